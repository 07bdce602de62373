// Stands in, in the web build, for react-native-web components that nothing in Voltcrib renders
// (see metro.config.js). They reach the bundle only because some packages read `react-native` as
// a whole object, which pulls in every export, lists and modals included (~100 KB of script on
// every first page). Code of ours that imports one of them gets the real component: the stand-in
// is used only for react-native-web's own wholesale exports. Rendering it fails loudly.
function LeftOutOfWebBuild() {
  throw new Error('This react-native-web component is left out of the Voltcrib web build; import it directly (metro.config.js lists what is left out).');
}

module.exports = LeftOutOfWebBuild;
module.exports.default = LeftOutOfWebBuild;
