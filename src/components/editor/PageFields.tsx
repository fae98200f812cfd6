import { PAGE_TITLE_MAX } from '~/lib/text-limits';

interface Props {
  isNew: boolean;
  title: string;
  section: string;
  sections: { slug: string; title: string }[];
  venueSlug: string;
  error?: { message: string; field?: string };
  onTitle: (title: string) => void;
  onSection: (section: string) => void;
}

/** The page's title and section, above the text. */
export function PageFields({ isNew, title, section, sections, venueSlug, error, onTitle, onSection }: Props) {
  const titleError = error?.field === 'title' ? error.message : undefined;
  const sectionError = error?.field === 'section' ? error.message : undefined;
  return (
    <div className="grid gap-3 sm:grid-cols-[1fr_16rem]">
      <div>
        <label htmlFor="tl-page-title" className="block text-sm font-semibold">
          Title
        </label>
        <input
          id="tl-page-title"
          value={title}
          onChange={(e) => onTitle(e.target.value)}
          maxLength={PAGE_TITLE_MAX}
          required
          autoFocus={isNew}
          aria-invalid={titleError ? true : undefined}
          aria-describedby={titleError ? 'tl-page-title-error' : undefined}
          className="mt-1 min-h-11 w-full rounded-md border border-line bg-surface px-3 text-lg font-semibold"
          data-testid="page-title-input"
        />
        {titleError && (
          <p id="tl-page-title-error" className="mt-1 text-sm text-danger">
            {titleError}
          </p>
        )}
      </div>
      <div>
        <label htmlFor="tl-page-section" className="block text-sm font-semibold">
          Section
        </label>
        <select
          id="tl-page-section"
          value={section}
          onChange={(e) => onSection(e.target.value)}
          className="mt-1 min-h-11 w-full rounded-md border border-line bg-surface px-2"
          data-testid="page-section"
        >
          {sections.map((s) => (
            <option key={s.slug} value={s.slug}>
              {s.title}
            </option>
          ))}
        </select>
        {sectionError ? (
          <p className="mt-1 text-sm text-danger">{sectionError}</p>
        ) : (
          <a href={`/venues/${venueSlug}/sections`} className="mt-1 inline-block text-xs text-muted underline">
            Edit the sections
          </a>
        )}
      </div>
    </div>
  );
}
