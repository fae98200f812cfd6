import type { APIRoute } from 'astro';
import { blockCurveText } from '~/lib/doc/blocks/block-curve-text';
import { processorBlocksInOrder } from '~/lib/doc/blocks/block-order';
import { contentDisposition } from '~/server/files/content-disposition';
import { handle, HttpError } from '~/server/http';
import { guardPage, loadPageWithCurrent } from '~/server/pages';

/** The computed curve of the n-th processor block of a page's current revision, as text columns. */
export const GET: APIRoute = (context) =>
  handle(async () => {
    const { venue, page, revision } = await guardPage(context.locals.principal, context.params.venue, context.params.page, 'venue.read', loadPageWithCurrent);
    const n = Number(context.params.n);
    const blocks = revision ? processorBlocksInOrder(revision.doc) : [];
    const node = Number.isInteger(n) && n >= 1 ? blocks[n - 1] : undefined;
    const text = node ? blockCurveText(node, `${venue.name} · ${page.title} · block ${n} (revision ${revision!.number}), computed`) : null;
    if (!text) throw new HttpError(404, 'This page has no EQ or crossover block with that number.');
    return new Response(text, {
      headers: {
        'content-type': 'text/plain; charset=utf-8',
        'content-disposition': contentDisposition('attachment', `${page.slug}-block-${n}-curve.txt`),
        'cache-control': 'private, no-store',
        'x-content-type-options': 'nosniff',
      },
    });
  });
