// What zod's `z.compile` module is in the web bundle (metro.config.js points zod/v4/core at this file
// instead of its compile.js, some 30 kB of minified script the app's first screen would load). The app
// never compiles a schema: index.ts sets zod to parse without generated code (`jitless`), which the
// content security policy requires, and parsing goes through zod's runtime parser, untouched. The same
// names, so zod's `export *` still finds them; calling one says plainly why it is missing.
export const INVALID = Symbol.for('zod.compile.invalid');

export class ZodCompileAsyncError extends Error {
  constructor(message = 'z.compile does not support async refinements, transforms, or checks') {
    super(message);
    this.name = 'ZodCompileAsyncError';
  }
}

export class ZodCompileUnsupportedError extends Error {
  islandable: boolean;
  constructor(feature: string, islandable = true) {
    super(`z.compile does not support ${feature}; this schema must use the runtime parser`);
    this.name = 'ZodCompileUnsupportedError';
    this.islandable = islandable;
  }
}

const leftOut = (name: string) => (): never => {
  throw new Error(
    `zod's ${name} is left out of the web app (metro.config.js): schemas parse with zod's runtime parser`,
  );
};

export const compile = leftOut('z.compile');
export const withParser = leftOut('withParser');
export const compileFn = leftOut('compileFn');
