// Devices load the app as one bundle: there is no chunk of shared lazy-screen code to wait for.
// The browser build does (see shared-chunk.web.ts).
export {};
