// Loads the wasm module: from inlined base64 bytes in the single-file page (no fetch at all),
// or next to the glue when the page is served from 127.0.0.1.
import * as glue from '../pkg/chiwave_web.js';

export async function loadCore() {
  const b64 = globalThis.__CHIWAVE_WASM_BASE64__;
  if (b64) {
    const bin = atob(b64);
    const bytes = new Uint8Array(bin.length);
    for (let i = 0; i < bin.length; i++) bytes[i] = bin.charCodeAt(i);
    glue.initSync({ module: bytes });
  } else {
    await glue.default();
  }
  return glue;
}
