export declare function acceptedWithoutBrotli(header: string): string;
