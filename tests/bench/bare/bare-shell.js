// The baseline page's only script of its own: hands Emscripten's GLFW the canvas.
var Module = {canvas: document.getElementById('canvas')};
