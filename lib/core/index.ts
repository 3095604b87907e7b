// The numeric core: pure functions over plain data, no I/O, safe to bundle for the browser.
export * from "./types.ts";
export * from "./physicalConstants.ts";
export * from "./coreInputError.ts";
export * from "./positions/index.ts";
export * from "./intensities/index.ts";
export * from "./bands/index.ts";
export * from "./spectra/index.ts";
export * from "./fitting/index.ts";
export * from "./calibration/index.ts";
