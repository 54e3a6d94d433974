/**
 * The page's script, served as /assets/page.js (same origin: a CSP of script-src 'self'
 * suffices; no inline handlers). Everything works without it; it only adds copy buttons, keeps
 * the samples field in step with its checkbox and marks the form busy while the server draws.
 */
export const PAGE_JS = `
'use strict';
(function () {
  var status = document.getElementById('copy-status');
  function say(text) { if (status) { status.textContent = text; } }
  function copyText(text) {
    if (navigator.clipboard && window.isSecureContext) return navigator.clipboard.writeText(text);
    return new Promise(function (resolve, reject) {
      var area = document.createElement('textarea');
      area.value = text; area.setAttribute('readonly', ''); area.className = 'skip';
      document.body.appendChild(area); area.select();
      var ok = false;
      try { ok = document.execCommand('copy'); } catch (e) { ok = false; }
      document.body.removeChild(area);
      if (ok) { resolve(); } else { reject(new Error('copy refused')); }
    });
  }
  document.querySelectorAll('button[data-copy]').forEach(function (button) {
    button.hidden = false;
    button.addEventListener('click', function () {
      var source = document.getElementById(button.getAttribute('data-copy'));
      if (!source) return;
      copyText(source.textContent || '').then(function () {
        say(button.getAttribute('data-label') + ' copied to the clipboard.');
        button.textContent = 'Copied';
        setTimeout(function () { button.textContent = 'Copy'; }, 1600);
      }, function () { say('Copying was refused by the browser; select the text and copy it by hand.'); });
    });
  });
  var check = document.getElementById('check');
  var samples = document.getElementById('samples');
  function sync() { if (check && samples) { samples.disabled = !check.checked; } }
  if (check) { check.addEventListener('change', sync); sync(); }
  var form = document.getElementById('draw-form');
  if (form) {
    form.addEventListener('submit', function () {
      var button = form.querySelector('button[type=submit]');
      if (button) { button.textContent = 'Drawing…'; }
      form.setAttribute('aria-busy', 'true');
    });
  }
})();
`;
