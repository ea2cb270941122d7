// The slice of Eleventy 3's programmatic API that renderSite uses (the package ships no types for it).
declare module '@11ty/eleventy' {
  export interface EleventyUserConfig {
    addFilter(name: string, fn: (...args: never[]) => unknown): unknown;
    addGlobalData(name: string, data: unknown): unknown;
    addPassthroughCopy(map: Record<string, string>): unknown;
    setNunjucksEnvironmentOptions(options: Record<string, unknown>): unknown;
    ignores: { add(glob: string): unknown };
    benchmarks?: { config?: { setIsVerbose(verbose: boolean): void } };
  }
  export interface EleventyOptions {
    quietMode?: boolean;
    configPath?: string;
    config?: (config: EleventyUserConfig) => void | Promise<void>;
  }
  export default class Eleventy {
    constructor(input?: string, output?: string, options?: EleventyOptions);
    disableLogger(): void;
    write(): Promise<unknown>;
  }
}
