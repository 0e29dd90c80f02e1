// Firn offline support, page side: registers the service worker (sw.js), tells the user when
// Firn is saved for offline use and when a newer version is ready, and switches to that
// version before any file of the old one is loaded. Runs before firn-shell.js, which waits
// for window.firnBeforeStart() before loading the calculator.
(function () {
  'use strict';

  var status = {state: 'starting', updateReady: false, persisted: null, build: null};
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

  // A waiting worker means the new version finished downloading during an earlier visit.
  function takeOver(worker) {
    return new Promise(function (resolve) {
      var finish = function (how) {
        if (status.takeOver) return;
        status.takeOver = how;
        resolve(how !== 'timed out');
      };
      worker.addEventListener('statechange', function () {
        if (worker.state === 'activated') finish('activated');
      });
      navigator.serviceWorker.addEventListener('controllerchange', function () {
        finish('controller changed');
      });
      // Asked again every second: a stopped worker may miss the first message while it starts.
      var asks = 0;
      var ask = function () {
        if (status.takeOver) return;
        if (++asks > 15) return finish('timed out');
        worker.postMessage('firn-take-over');
        setTimeout(ask, 1000);
      };
      ask();
    });
  }

  window.firnBeforeStart = function () {
    if (!supported) return Promise.resolve();
    return navigator.serviceWorker.getRegistration().then(function (registration) {
      status.waitingAtStart = !!(registration && registration.waiting);
      if (!registration || !registration.waiting || !navigator.serviceWorker.controller) return;
      status.state = 'switching';
      return takeOver(registration.waiting).then(function (activated) {
        if (!activated) return;
        location.reload();
        return new Promise(function () {});  // never start the old version's calculator
      });
    }, function () {});
  };

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
