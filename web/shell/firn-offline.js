// Firn offline support, page side: registers the service worker (sw.js), tells the user when
// Firn is saved for offline use and when a newer version is ready, and reloads when a newer
// version takes over before this page has finished starting. Runs before firn-shell.js.
(function () {
  'use strict';

  var buildMeta = document.querySelector('meta[name="firn-build"]');
  // pageBuild: the build this page itself belongs to; build: what the active worker reports.
  var status = {state: 'starting', updateReady: false, persisted: null, build: null,
                pageBuild: buildMeta ? buildMeta.content : null};
  window.firnOffline = status;
  var supported = 'serviceWorker' in navigator && window.isSecureContext;

  var bannersShown = 0;
  function banner(text, withReload) {
    var box = document.getElementById('offline-note');
    box.textContent = '';
    var message = document.createElement('p');
    message.textContent = text;
    box.appendChild(message);
    var buttons = document.createElement('div');
    if (withReload) {
      var reload = document.createElement('button');
      reload.type = 'button';
      reload.textContent = 'Reload now';
      reload.addEventListener('click', function () { location.reload(); });
      buttons.appendChild(reload);
    }
    var close = document.createElement('button');
    close.type = 'button';
    close.textContent = withReload ? 'Later' : 'OK';
    close.addEventListener('click', function () { box.hidden = true; });
    buttons.appendChild(close);
    box.appendChild(buttons);
    box.hidden = false;
    var shown = ++bannersShown;
    if (!withReload) setTimeout(function () { if (bannersShown === shown) box.hidden = true; }, 12000);
  }

  function announceUpdate() {
    if (status.updateReady) return;
    status.updateReady = true;
    banner('A newer version of Firn has been downloaded and saved on this device. ' +
           'It takes over the next time you open or reload Firn.', true);
  }

  // A new version takes over as soon as it is saved (sw.js). This page asked for each of its
  // files tagged with its own build, and the new worker refuses those, so a page that has not
  // finished starting must reload to run the new version whole; a running page keeps going.
  navigator.serviceWorker && navigator.serviceWorker.addEventListener('controllerchange', function () {
    if (!window.firnStarted) {
      status.state = 'switching';
      location.reload();
      return;
    }
    announceUpdate();
  });

  function watch(registration) {
    var follow = function (worker) {
      if (!worker) return;
      worker.addEventListener('statechange', function () {
        if (worker.state === 'installed' && navigator.serviceWorker.controller) announceUpdate();
      });
    };
    if (registration.waiting && navigator.serviceWorker.controller) announceUpdate();
    follow(registration.installing);
    registration.addEventListener('updatefound', function () { follow(registration.installing); });
    var lastCheck = Date.now();
    document.addEventListener('visibilitychange', function () {
      if (document.visibilityState === 'visible' && navigator.onLine &&
          Date.now() - lastCheck > 30 * 60 * 1000) {
        lastCheck = Date.now();
        registration.update().catch(function () {});
      }
    });
  }

  if (!supported) {
    status.state = 'unsupported';
    return;
  }
  var firstInstall = !navigator.serviceWorker.controller;
  navigator.serviceWorker.addEventListener('message', function (event) {
    if (event.data && event.data.type === 'firn-build') status.build = event.data;
  });
  navigator.serviceWorker.startMessages();
  window.addEventListener('load', function () {
    navigator.serviceWorker.register('sw.js', {scope: './'}).then(function (registration) {
      status.state = 'registered';
      watch(registration);
      return navigator.serviceWorker.ready;
    }).then(function (registration) {
      status.state = 'ready';
      if (registration.active) registration.active.postMessage('firn-build');
      if (firstInstall) {
        banner('Firn is now saved on this device and works without a connection.', false);
      }
      // Ask the browser not to evict the saved copy when storage runs low.
      if (navigator.storage && navigator.storage.persist) {
        return navigator.storage.persist().then(function (granted) { status.persisted = granted; });
      }
    }).catch(function (error) {
      status.state = 'failed';
      status.error = String(error);
    });
  });
})();
