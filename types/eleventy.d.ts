// Eleventy 3 ships no types for its main export; these lines cover what the render stage calls.
declare module '@11ty/eleventy' {
  interface EleventyOptions {
    configPath?: string;
    quietMode?: boolean;
    config?: (eleventyConfig: EleventyUserConfig) => void;
  }
  export interface EleventyUserConfig {
    addGlobalData(name: string, value: unknown): void;
    addFilter(name: string, filter: (...args: never[]) => unknown): void;
  }
  export default class Eleventy {
    constructor(input: string, output: string, options?: EleventyOptions);
    write(): Promise<unknown>;
    disableLogger(): void;
    toJSON(): Promise<Array<{ url: string; inputPath: string; outputPath: string; content: string }>>;
  }
}
