import { defineCollection, z } from 'astro:content';
import { glob } from 'astro/loaders';

/** One guide per calculator: how to use it, the formula behind it, and where the formula comes from. */
const guides = defineCollection({
  loader: glob({ pattern: '*.mdx', base: './content/calculators' }),
  schema: z.object({
    title: z.string(),
    summary: z.string(),
    /** Published sources, one per line, as a reader would look them up. */
    sources: z.array(z.string()).min(1),
  }),
});

export const collections = { guides };
