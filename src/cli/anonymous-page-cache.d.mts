import type { IncomingHttpHeaders, IncomingMessage, ServerResponse } from 'node:http';
export declare const ANONYMOUS_MARK: string;
export declare function carriesCredentials(headers: IncomingHttpHeaders): boolean;
export declare function acceptsGzip(header: string | undefined): boolean;
export declare function anonymousPageCache(options?: { maxEntries?: number; maxEntryBytes?: number }): (req: IncomingMessage, res: ServerResponse, next: () => void) => void;
