// The two small scripts of the served pages, sent inline with the response's nonce (the pages'
// Content-Security-Policy allows no other script). Neither is needed to read a pack or to save a
// session: the form posts without them.

/**
 * A draft or the index: reload when the server says the job changed, keeping the scroll position.
 * On connecting, the server tells a draft's page the job's version: a save made while the page
 * was loading is not missed.
 */
export const RELOAD_SCRIPT = `(() => {
  const me = document.currentScript;
  const job = me.dataset.job || '';
  const mine = Number(me.dataset.version);
  const key = 'packsmith-scroll:' + location.pathname;
  const y = sessionStorage.getItem(key);
  if (y !== null) { sessionStorage.removeItem(key); window.scrollTo(0, Number(y)); }
  const es = new EventSource('/events' + (job ? '?job=' + encodeURIComponent(job) : ''));
  es.addEventListener('reload', (e) => {
    let told = null;
    try { told = JSON.parse(e.data); } catch { told = null; }
    if (job && told && told.version === mine) return;
    sessionStorage.setItem(key, String(window.scrollY));
    es.close();
    location.reload();
  });
})();`;

/**
 * The session form: Enter moves to the next field, Ctrl+Enter (or Ctrl+S) saves; what is typed is
 * kept in this browser's localStorage until it is saved or discarded, and offered again after a reload.
 */
export const FORM_SCRIPT = `(() => {
  const form = document.getElementById('session');
  const key = 'packsmith-session:' + form.dataset.job;
  const inputs = () => [...form.querySelectorAll('input[name], select[name]')];
  const note = document.getElementById('restored');
  const keep = () => {
    const v = {};
    for (const el of inputs()) if (el.value !== '' && el.name !== 'date') v[el.name] = el.value;
    if (Object.keys(v).length) localStorage.setItem(key, JSON.stringify(v)); else localStorage.removeItem(key);
  };
  if (form.dataset.fresh === '1') {
    let kept = null;
    try { kept = JSON.parse(localStorage.getItem(key) || 'null'); } catch { kept = null; }
    if (kept && typeof kept === 'object') {
      let n = 0;
      for (const el of inputs()) if (Object.hasOwn(kept, el.name) && el.value === '') { el.value = String(kept[el.name]); n++; }
      if (n > 0) note.hidden = false;
    }
  }
  form.addEventListener('input', keep);
  form.addEventListener('change', keep);
  form.addEventListener('submit', () => localStorage.removeItem(key));
  document.getElementById('discard').addEventListener('click', () => {
    for (const el of inputs()) if (el.name !== 'date') el.value = '';
    localStorage.removeItem(key);
    note.hidden = true;
  });
  form.addEventListener('keydown', (e) => {
    if ((e.ctrlKey || e.metaKey) && (e.key === 'Enter' || e.key === 's')) {
      e.preventDefault();
      form.requestSubmit();
      return;
    }
    if (e.key === 'Enter' && e.target.matches('input')) {
      e.preventDefault();
      const all = inputs().filter((el) => !el.disabled && el.type !== 'hidden');
      const next = all[all.indexOf(e.target) + 1];
      if (next) next.focus(); else form.querySelector('button[type=submit]').focus();
    }
  });
})();`;
