// Types of compiled.js (plain JavaScript: it runs before any TypeScript can).
export declare const libDir: string;
export declare const stampPath: string;
export declare const eleventyConfigSource: string;
export declare function compiledIsFresh(): boolean;
