// Stands in for zod's `core/compile.js` in the web build (see metro.config.js). The app never
// calls `z.compile`, and zod's parser does not use it; the real module is ~30 KB of minified
// script on every first page. Calling it here fails loudly rather than quietly.
const INVALID = Symbol.for('zod.compile.invalid');

class ZodCompileAsyncError extends Error {
  constructor(message = 'z.compile does not support async refinements, transforms, or checks') {
    super(message);
    this.name = 'ZodCompileAsyncError';
  }
}

class ZodCompileUnsupportedError extends Error {
  constructor(feature, islandable = true) {
    super(`z.compile does not support ${feature}; this schema must use the runtime parser`);
    this.name = 'ZodCompileUnsupportedError';
    this.islandable = islandable;
  }
}

function leftOut() {
  throw new Error('z.compile is left out of the Voltcrib web build (metro.config.js); use schema.parse');
}

module.exports = { INVALID, ZodCompileAsyncError, ZodCompileUnsupportedError, compile: leftOut, withParser: leftOut, compileFn: leftOut };
