import { describe, expect, it } from 'vitest';
import { displayText } from './display-text';
import { PageCreateSchema, SectionCreateSchema } from './page';
import { VenueCreateSchema } from './venue';
import { FileCaptionSchema } from './file';

const rule = displayText('the title', { min: 1, max: 20 });

describe('the display-text rule for names people type', () => {
  it.each([
    ['U+202E right-to-left override', 'Rack\u202Egnp.exe'],
    ['U+202A left-to-right embedding', 'a\u202Ab'],
    ['U+2066 isolate', 'a\u2066b'],
    ['U+200F right-to-left mark', 'a\u200Fb'],
    ['U+061C Arabic letter mark', 'a\u061Cb'],
    ['NUL', 'a\u0000b'],
    ['escape', 'a\u001B[31mb'],
    ['DEL', 'a\u007Fb'],
    ['C1 control', 'a\u0085b'],
    ['a line break', 'a\nb'],
  ])('refuses %s', (_, value) => {
    const result = rule.safeParse(value);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].message).toMatch(/control or text-direction character/);
  });
  it('trims and keeps letters of any script', () => {
    expect(rule.parse('  Hall \u05D0\u05D1 ')).toBe('Hall \u05D0\u05D1');
    expect(rule.parse('Sála Přední')).toBe('Sála Přední');
  });
  it('is the rule of titles, section titles, venue names and towns, captions and summaries', () => {
    const evil = 'x\u202Ey';
    expect(PageCreateSchema.safeParse({ title: evil, section: 'stage', doc: {} }).success).toBe(false);
    expect(PageCreateSchema.safeParse({ title: 'ok', section: 'stage', doc: {}, summary: evil }).success).toBe(false);
    expect(SectionCreateSchema.safeParse({ title: evil }).success).toBe(false);
    expect(VenueCreateSchema.safeParse({ name: evil }).success).toBe(false);
    expect(VenueCreateSchema.safeParse({ name: 'Hall', town: evil }).success).toBe(false);
    expect(FileCaptionSchema.safeParse({ caption: evil }).success).toBe(false);
    expect(PageCreateSchema.safeParse({ title: 'Patch', section: 'stage', doc: {}, summary: 'tidied' }).success).toBe(true);
  });
});
