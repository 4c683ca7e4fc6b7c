// The slice of eleventy's programmatic API zfolio uses (the package ships no type declarations).
declare module '@11ty/eleventy' {
  interface EleventyOptions {
    configPath?: string;
    quietMode?: boolean;
    config?: (config: { addGlobalData(name: string, value: unknown): void; ignores: { add(glob: string): void } }) => void | Promise<void>;
  }
  export default class Eleventy {
    constructor(input: string, output: string, options?: EleventyOptions);
    /** Reads the configuration and finds the templates; write() does it first when it has not been done. */
    init(): Promise<void>;
    write(): Promise<unknown>;
    disableLogger(): void;
  }
}
