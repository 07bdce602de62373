// Stands in, in the web build, for expo-router modules that Voltcrib never runs (see
// metro.config.js): the route sitemap (turned off in app.json), header search bars (no screen
// shows a header), link previews (iOS only) and React Navigation's static configuration API (the
// routes come from app/). They arrive only because expo-router's index re-exports them. Each
// export is a component that fails loudly if anything ever renders or calls it.
const standIns = new Map();

function standIn(name) {
  if (!standIns.has(name)) {
    const leftOut = function LeftOutOfWebBuild() {
      throw new Error(`expo-router's ${String(name)} is left out of the Voltcrib web build (metro.config.js lists what is left out).`);
    };
    standIns.set(name, leftOut);
  }
  return standIns.get(name);
}

module.exports = new Proxy({}, { get: (_target, name) => (name === '__esModule' ? true : standIn(name)) });
