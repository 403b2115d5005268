/**
 * The review page's only script (runs in the browser, so plain ES2017 in a
 * string): load a demo or a file into the editor, post the JSON to
 * POST v1/reports (relative, so the page works under any path prefix), and
 * show the answer — the report in a sandboxed frame, or the error the API
 * gave. The server sends this text with a CSP hash, so no other script runs.
 */
export const REVIEW_PAGE_SCRIPT = `
(function () {
  'use strict';
  var demos = JSON.parse(document.getElementById('demo-data').textContent);
  var editor = document.getElementById('request');
  var select = document.getElementById('demo');
  var file = document.getElementById('file');
  var form = document.getElementById('review-form');
  var status = document.getElementById('status');
  var errorBox = document.getElementById('error');
  var frame = document.getElementById('report');
  var download = document.getElementById('download');
  var lastUrl = null;

  function setStatus(state, text) {
    status.setAttribute('data-state', state);
    status.textContent = text;
  }
  function showError(text) {
    errorBox.hidden = false;
    errorBox.textContent = text;
  }
  function loadDemo() {
    var demo = demos.filter(function (d) { return d.id === select.value; })[0];
    if (!demo) return;
    editor.value = JSON.stringify(demo.request, null, 2);
    document.getElementById('demo-description').textContent = demo.description;
  }
  select.addEventListener('change', loadDemo);
  document.getElementById('load-demo').addEventListener('click', loadDemo);
  file.addEventListener('change', function () {
    var f = file.files && file.files[0];
    if (!f) return;
    var reader = new FileReader();
    reader.onload = function () { editor.value = String(reader.result); };
    reader.readAsText(f);
  });
  frame.addEventListener('load', function () {
    try {
      var doc = frame.contentDocument;
      if (doc && doc.documentElement) frame.style.height = (doc.documentElement.scrollHeight + 24) + 'px';
    } catch (e) { /* the frame keeps its default height */ }
  });
  form.addEventListener('submit', function (event) {
    event.preventDefault();
    errorBox.hidden = true;
    var body;
    try {
      body = JSON.parse(editor.value);
    } catch (e) {
      setStatus('error', 'The request is not valid JSON.');
      showError(String(e && e.message ? e.message : e));
      return;
    }
    setStatus('busy', 'Analysing…');
    fetch('v1/reports', { method: 'POST', headers: { 'content-type': 'application/json', accept: 'text/html' }, body: JSON.stringify(body) })
      .then(function (response) {
        return response.text().then(function (text) { return { ok: response.ok, status: response.status, text: text }; });
      })
      .then(function (answer) {
        if (!answer.ok) {
          var message = answer.text;
          try {
            var e = JSON.parse(answer.text);
            message = e.statusCode + ' ' + e.code + ': ' + e.message + (e.issues ? '\\n' + e.issues.map(function (i) { return '  at ' + i.path.join('.') + ': ' + i.message; }).join('\\n') : '');
          } catch (ignore) { /* not JSON: show it as it came */ }
          setStatus('error', 'The API refused the request (' + answer.status + ').');
          showError(message);
          return;
        }
        frame.srcdoc = answer.text;
        if (lastUrl) URL.revokeObjectURL(lastUrl);
        lastUrl = URL.createObjectURL(new Blob([answer.text], { type: 'text/html' }));
        download.href = lastUrl;
        download.hidden = false;
        setStatus('ready', 'Report ready.');
      })
      .catch(function (e) {
        setStatus('error', 'The API could not be reached.');
        showError(String(e));
      });
  });
  loadDemo();
})();
`;
