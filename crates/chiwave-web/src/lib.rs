//! Thin wasm-bindgen layer: JS values in, one core call, JS values or a JsError out.
