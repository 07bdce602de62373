/**
 * Native builds decode QR codes with the platform's own scanner: nothing to prepare.
 * The web build (prepare-decoder.web.ts) has to point the WebAssembly decoder at our origin.
 */
export async function prepareDecoder(): Promise<void> {}
