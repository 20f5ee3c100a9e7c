// The worker side of web/browser/solver_worker.cpp: answers {id, request} messages with
// {kind: 'done', id, result} once the module has started.
Module['onRuntimeInitialized'] = function () {
  Module.apportionReady = true;
  postMessage({ kind: 'ready' });
  if (Module.apportionPending) Module.apportionPending();
};
self.onmessage = function (e) {
  var m = e.data;
  var run = function () {
    var result = Module.ccall('apportion_worker_solve', 'string', ['number', 'string'], [m.id, m.request]);
    postMessage({ kind: 'done', id: m.id, result: result });
  };
  if (Module.apportionReady) run(); else Module.apportionPending = run;
};
