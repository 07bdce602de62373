// Stands in for zod's `classic/from-json-schema.js` in the web build (see metro.config.js): the
// app builds its schemas in code and never converts JSON Schema into zod.
function fromJSONSchema() {
  throw new Error('z.fromJSONSchema is left out of the Voltcrib web build (metro.config.js)');
}

module.exports = { fromJSONSchema };
