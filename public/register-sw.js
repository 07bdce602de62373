// Registers the service worker that lets Voltcrib open without a network once it has been opened
// (dist/sw.js, made by the web build). A plain file, not inline: the page's CSP allows only
// scripts from our own origin.
if ('serviceWorker' in navigator) {
  window.addEventListener('load', function () {
    navigator.serviceWorker.register('/sw.js').catch(function (error) {
      console.warn('Voltcrib: offline support is unavailable', error);
    });
  });
}
