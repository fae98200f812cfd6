import type { APIContext } from 'astro';
import { handle } from '~/server/http';
import { fileResponse, loadReadableFile, parseVariant } from './serve-file';

/**
 * GET /files/:id[/:variant]. A browser that opens the link while signed out is sent to sign in
 * and back; an image tag or a script gets a plain 401.
 */
export function serveFileRoute({ locals, params, request, url, redirect }: APIContext, variant: string | undefined): Promise<Response> {
  if (!locals.user && /\btext\/html\b/.test(request.headers.get('accept') ?? '')) {
    return Promise.resolve(redirect(`/signin?next=${encodeURIComponent(url.pathname + url.search)}`, 303));
  }
  return handle(async () => {
    const row = await loadReadableFile(locals.principal, params.id);
    return fileResponse(row, parseVariant(variant), request, url.searchParams.get('download') === '1');
  });
}
