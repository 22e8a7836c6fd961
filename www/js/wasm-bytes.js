// The wasm module's bytes when they travel inside the bundle. For the served page this stays
// null and the wasm-bindgen glue fetches chiwave_web_bg.wasm beside the bundle; for the single
// file, www/tools/build.mjs replaces this module with one that exports the inlined bytes.
export const WASM_BYTES = null;
