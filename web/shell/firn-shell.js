// Firn page shell: checks the browser can run the calculator, loads firn.js/firn.wasm, turns
// touches into mouse events, and wakes the paused main loop on input. Kept in a file of its
// own (no inline script) so the page's Content-Security-Policy can forbid inline code.
(function () {
  'use strict';

  var canvas = document.getElementById('canvas');
  var loading = document.getElementById('loading');
  var progress = document.getElementById('loading-progress');
  var problemBox = document.getElementById('problem');
  var runner = 0;      // pointer handed over by main(); 0 until the app runs
  var running = false;

  var problems = {
    webgl: ['This browser cannot draw Firn',
            'Firn draws its screens with WebGL 2, which this browser or device does not offer ' +
            '(or has turned off). Try a current browser, or switch on hardware acceleration.'],
    wasm: ['Firn could not load',
           'The calculator (firn.wasm) did not load. If you are offline and have never opened ' +
           'Firn on this device before, connect once and reload.'],
    crash: ['Firn stopped',
            'Firn hit an internal error and stopped. Reload the page to start again.']
  };
  var fallback = 'Meanwhile, use the printed pocket card or the firn command-line tool.';

  function showProblem(kind, detail) {
    var text = problems[kind] || problems.crash;
    problemBox.textContent = '';
    var heading = document.createElement('h1');
    heading.textContent = text[0];
    var body = document.createElement('p');
    body.textContent = text[1] + ' ' + fallback;
    problemBox.appendChild(heading);
    problemBox.appendChild(body);
    if (detail) {
      var small = document.createElement('p');
      small.textContent = 'Details: ' + detail;
      problemBox.appendChild(small);
    }
    problemBox.hidden = false;
    loading.hidden = true;
    canvas.hidden = true;
    window.firnProblem = kind;
  }

  function wake() {
    if (runner && typeof Module._firn_wake === 'function') Module._firn_wake(runner);
  }

  window.firnShell = {
    showProblem: showProblem,
    wake: wake,  // for page code that finishes later (a picked file has been read)
    started: function (pointer) {
      runner = pointer;
      running = true;
      loading.hidden = true;
      window.firnStarted = true;
    }
  };

  // Emscripten's GLFW treats touches as presses at the last mouse position and cannot drag;
  // as mouse events they behave like a mouse: the cursor moves first, then presses.
  var touchToMouse = {touchstart: 'mousedown', touchmove: 'mousemove', touchend: 'mouseup',
                      touchcancel: 'mouseup'};
  function forwardTouch(event) {
    if (event.target !== canvas) return;
    var touch = event.changedTouches[0];
    if (!touch) return;
    event.preventDefault();
    event.stopPropagation();
    var type = touchToMouse[event.type];
    var init = {bubbles: true, cancelable: true, clientX: touch.clientX, clientY: touch.clientY,
                screenX: touch.screenX, screenY: touch.screenY, button: 0,
                buttons: type === 'mouseup' ? 0 : 1};
    if (type === 'mousedown') queueMouse('mousemove', init);
    queueMouse(type, init);
    // A finger leaves nothing hovering: once a frame has taken the release, the pointer moves
    // off the canvas, else the last key stays lit like a selected button.
    if (type === 'mouseup') {
      queueMouse('mousemove', Object.assign({}, init, {clientX: -1000, clientY: -1000,
                                                       screenX: -1000, screenY: -1000}), true);
    }
  }

  // ImGui 1.86 has no input queue: a press and its release (or a release and the next press)
  // that reach the app inside one frame merge, and the tap is lost. Quick taps on a slow phone
  // do exactly that, so a touch-made button event waits until a frame has seen the one before.
  // Moves wait too: the frame that takes a press must see where the finger went down, or a
  // quick flick would look to the app like a tap at its end point (the app tells a tap from a
  // scroll by the distance from the press; see tap_slop in core/ui/widgets.hpp).
  var pendingMouse = [];
  var lastButtonFrame = -1;
  var flushScheduled = false;
  function framesDrawn() { return window.firnFramesDrawn || 0; }
  function queueMouse(type, init, afterFrame) {
    pendingMouse.push({type: type, init: init, afterFrame: !!afterFrame});
    flushMouse();
  }
  function flushMouse() {
    flushScheduled = false;
    while (pendingMouse.length) {
      var next = pendingMouse[0];
      var button = next.type !== 'mousemove' || next.afterFrame;
      if (lastButtonFrame >= 0 && framesDrawn() <= lastButtonFrame) {
        wake();
        if (!flushScheduled) {
          flushScheduled = true;
          window.requestAnimationFrame(flushMouse);
        }
        return;
      }
      pendingMouse.shift();
      canvas.dispatchEvent(new MouseEvent(next.type, next.init));
      if (button) lastButtonFrame = framesDrawn();
      wake();
    }
  }
  Object.keys(touchToMouse).forEach(function (type) {
    window.addEventListener(type, forwardTouch, {capture: true, passive: false});
  });

  // Any of these may change what the UI shows; the loop pauses again once ImGui has settled.
  ['pointerdown', 'pointermove', 'pointerup', 'pointercancel', 'mousedown', 'mousemove',
   'mouseup', 'wheel', 'keydown', 'keyup', 'keypress', 'focus', 'blur', 'resize',
   'orientationchange'].forEach(function (type) {
    window.addEventListener(type, wake, {capture: true, passive: true});
  });
  document.addEventListener('visibilitychange', wake);
  if (window.visualViewport) window.visualViewport.addEventListener('resize', wake);
  if (window.matchMedia) {
    // devicePixelRatio changes (browser zoom, moving to another screen) fire no resize event.
    var watchRatio = function () {
      var query = window.matchMedia('(resolution: ' + window.devicePixelRatio + 'dppx)');
      var changed = function () { query.removeEventListener('change', changed); wake(); watchRatio(); };
      query.addEventListener('change', changed);
    };
    watchRatio();
  }

  function hasWebGL2() {
    try {
      var probe = document.createElement('canvas');
      var gl = probe.getContext('webgl2');
      if (!gl) return false;
      var lose = gl.getExtension('WEBGL_lose_context');
      if (lose) lose.loseContext();
      return true;
    } catch (e) {
      return false;
    }
  }

  // Emscripten 3.1.6 leaves a failed firn.wasm download as an unhandled rejection ("Failed to
  // fetch"), never calling onAbort: before the calculator runs, any such failure is a load
  // problem the user must be told about, not a page stuck on "Firn is starting…".
  window.addEventListener('unhandledrejection', function (event) {
    if (!running && !window.firnProblem) showProblem('wasm', String(event.reason));
  });

  // "Loading the calculator: 310 of 750 KB": a first visit on a weak link shows it moving. The
  // total is firn.wasm's size as built (make_site.mjs); the stream counts bytes after any
  // transfer compression, so the two compare.
  function showProgress(loaded, total) {
    var kb = function (bytes) { return Math.round(bytes / 1024).toLocaleString('en-US'); };
    progress.textContent = total > 0
        ? 'Loading the calculator: ' + kb(Math.min(loaded, total)) + ' of ' + kb(total) + ' KB'
        : 'Loading the calculator: ' + kb(loaded) + ' KB';
    window.firnLoadedBytes = loaded;
  }

  function countedResponse(response, total) {
    if (!response.body || typeof ReadableStream !== 'function') return response;
    var reader = response.body.getReader();
    var loaded = 0;
    var stream = new ReadableStream({
      pull: function (controller) {
        return reader.read().then(function (chunk) {
          if (chunk.done) return controller.close();
          loaded += chunk.value.byteLength;
          showProgress(loaded, total);
          controller.enqueue(chunk.value);
        });
      }
    });
    return new Response(stream, {headers: {'Content-Type': 'application/wasm'}});
  }

  // Emscripten's hook for loading the module ourselves: the same URL and credentials as its
  // own fetch (so the page's preload is used), compiled while it streams in.
  function instantiateWasm(url, total) {
    return function (imports, receiveInstance) {
      showProgress(0, total);
      fetch(url, {credentials: 'same-origin'}).then(function (response) {
        if (!response.ok) throw new Error('firn.wasm: HTTP ' + response.status);
        var counted = countedResponse(response, total);
        if (typeof WebAssembly.instantiateStreaming === 'function') {
          return WebAssembly.instantiateStreaming(counted, imports);
        }
        return counted.arrayBuffer().then(function (bytes) {
          return WebAssembly.instantiate(bytes, imports);
        });
      }).then(function (result) {
        progress.textContent = 'Firn is starting…';
        receiveInstance(result.instance, result.module);
      }).catch(function (error) {
        if (!window.firnProblem) showProblem('wasm', String(error));
      });
      return {};  // exports arrive through receiveInstance
    };
  }

  function start() {
    if (typeof WebAssembly !== 'object') return showProblem('wasm', 'no WebAssembly in this browser');
    if (!hasWebGL2()) return showProblem('webgl');
    // Ask for this page's own build of the calculator (see make_site.mjs and sw.js).
    var meta = document.querySelector('meta[name="firn-build"]');
    var tag = meta ? '?build=' + encodeURIComponent(meta.content) : '';
    var size = document.querySelector('meta[name="firn-wasm-bytes"]');
    window.Module = {
      canvas: canvas,
      locateFile: function (path, prefix) { return prefix + path + tag; },
      print: function (text) { console.log(text); },
      printErr: function (text) { console.warn(text); },
      onAbort: function (what) { showProblem(running ? 'crash' : 'wasm', String(what || '')); },
      instantiateWasm: instantiateWasm('firn.wasm' + tag, size ? Number(size.content) : 0)
    };
    var script = document.createElement('script');
    script.src = 'firn.js' + tag;
    script.onerror = function () { showProblem('wasm', 'firn.js did not load'); };
    document.body.appendChild(script);
  }

  start();
})();
