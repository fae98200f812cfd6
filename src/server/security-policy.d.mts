export declare const CSP_DIRECTIVES: string[];
export declare const SCRIPT_SOURCES: string[];
export declare const STYLE_SOURCES: string[];
export declare const BASE_CSP: string;
export declare function securityHeaders(hstsMaxAge?: number): Record<string, string>;
export declare function hstsFromEnv(env: Record<string, string | undefined>): number;
export declare const STYLE_INLINE_DIRECTIVES: string[];
export declare function completePagePolicy(csp: string): string;
