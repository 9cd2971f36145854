// What zod's `z.fromJSONSchema` is in the web bundle (metro.config.js points zod/v4/classic at this
// file instead of its from-json-schema.js, some 12 kB of minified script). The app builds its schemas
// in db/contracts and never from JSON Schema; calling it says plainly why it is missing.
export function fromJSONSchema(): never {
  throw new Error(
    "zod's z.fromJSONSchema is left out of the web app (metro.config.js): the schemas come from db/contracts",
  );
}
