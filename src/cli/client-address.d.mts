export declare function parseTrustedProxies(setting: string | undefined): Set<string>;
export declare function clientAddressFor(socketAddress: string | undefined, forwardedFor: string | string[] | undefined, trusted: Set<string>): string;
