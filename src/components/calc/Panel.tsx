import type { ReactNode } from 'react';

interface Props {
  title: string;
  /** The guide section that explains this panel's formula and sources. */
  guide: string;
  children: ReactNode;
  testId?: string;
}

/** One calculator card with its "how it works" link one tap away. */
export default function Panel({ title, guide, children, testId }: Props) {
  return (
    <section data-testid={testId} className="rounded-xl border border-line bg-surface p-4 shadow-sm">
      <div className="mb-3 flex items-baseline justify-between gap-3">
        <h2 className="text-lg font-bold tracking-tight">{title}</h2>
        <a href={guide} className="inline-flex min-h-11 items-center rounded-md px-2 text-sm text-accent underline underline-offset-2">
          Formula &amp; sources
        </a>
      </div>
      <div className="flex flex-col gap-4">{children}</div>
    </section>
  );
}
