export declare const BUILD_DIR: string;
export declare const SERVER_ENTRY: string;
export declare function buildIfStale(): boolean;
