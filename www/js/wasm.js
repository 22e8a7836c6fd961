// Loads the wasm module: from the bytes inlined in the single-file page (no fetch at all),
// or next to the bundle when the page is served from 127.0.0.1.
import * as glue from '../pkg/chiwave_web.js';
import { WASM_BYTES } from './wasm-bytes.js';

export async function loadCore() {
  if (WASM_BYTES) glue.initSync({ module: WASM_BYTES });
  else await glue.default();
  return glue;
}
