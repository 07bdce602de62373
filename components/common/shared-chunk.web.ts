// Metro's web export gathers the modules that two or more lazy screens share (the gate's rules,
// the HV tables, booking schemas…) into one `__common` chunk and lists it in index.html as a
// script of the first screen, although sign-in and Today never run any of it. The web build
// (scripts/lib/web-shared-chunk.ts) takes that script out of the page and names the chunk in
// `<meta name="voltcrib-shared-chunk">` instead; here, before any lazy screen can be asked for,
// every chunk load first loads the shared chunk (once), so a lazy screen finds its modules.
type LoadBundle = (bundlePath: string) => Promise<unknown>;

const globals = globalThis as unknown as Record<string, LoadBundle | string | undefined>;
const LOADER = `${(globals.__METRO_GLOBAL_PREFIX__ as string | undefined) ?? ''}__loadBundleAsync`;
const loadBundle = globals[LOADER] as LoadBundle | undefined;
const sharedChunk = typeof document === 'undefined' ? null : document.querySelector<HTMLMetaElement>('meta[name="voltcrib-shared-chunk"]')?.content;

if (loadBundle && sharedChunk) {
  let sharedLoaded: Promise<unknown> | null = null;
  globals[LOADER] = ((bundlePath: string) => {
    if (bundlePath === sharedChunk) return loadBundle(bundlePath);
    // A failed load is tried again with the next lazy screen (the loader forgets failures too).
    sharedLoaded ??= loadBundle(sharedChunk).catch((error: unknown) => {
      sharedLoaded = null;
      throw error;
    });
    return sharedLoaded.then(() => loadBundle(bundlePath));
  }) satisfies LoadBundle;
}

export {};
