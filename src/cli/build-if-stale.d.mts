export declare const BUILD_DIR: string;
export declare const SERVER_ENTRY: string;
export declare const SERVE_SCRIPT: string;
export declare function buildIfStale(): boolean;
