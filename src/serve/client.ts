// The two small scripts of the served pages, sent inline with the response's nonce (the pages'
// Content-Security-Policy allows no other script). Neither is needed to read a pack or to save a
// session: the form posts without them.

/**
 * A draft, its errors or the index: kept current when the server says the job changed. A draft
 * (`data-patch`) asks the server which elements changed since the version it shows and makes
 * just those the same as the new ones, node by node (text, attributes, or a node of another kind
 * replaced), keeping what is at the top of the window where it is; anything else, or a patch that
 * does not fit the page, reloads the page, keeping the scroll position. On connecting, the server
 * tells a draft's page the job's version: a save made while the page was loading is not missed.
 */
export const RELOAD_SCRIPT = `(() => {
  const me = document.currentScript;
  const job = me.dataset.job || '';
  const patching = me.dataset.patch === '1';
  let mine = Number(me.dataset.version);
  let wanted = mine;
  let busy = false;
  const key = 'packsmith-scroll:' + location.pathname;
  const y = sessionStorage.getItem(key);
  if (y !== null) { sessionStorage.removeItem(key); window.scrollTo(0, Number(y)); }
  const es = new EventSource('/events' + (job ? '?job=' + encodeURIComponent(job) : ''));
  const reload = () => {
    sessionStorage.setItem(key, String(window.scrollY));
    es.close();
    location.reload();
  };
  // the element with an id at the top of the window, and where it is: kept there by the update
  const anchor = () => {
    for (let el = document.elementFromPoint(innerWidth / 2, 1); el; el = el.parentElement) {
      if (el.id) return { id: el.id, top: el.getBoundingClientRect().top };
    }
    return null;
  };
  // make the old element the same as the new one (parsed from the new HTML), touching only what
  // differs, so the browser styles and lays out again just that; a node of another kind is replaced
  // whole, and so are the children of an element whose number of children changed
  const same = (a, b) => a.nodeType === b.nodeType && a.nodeName === b.nodeName && a.namespaceURI === b.namespaceURI;
  const morph = (old, now) => {
    if (old.nodeType !== 1) {
      if (old.nodeValue !== now.nodeValue) old.nodeValue = now.nodeValue;
      return;
    }
    const oa = old.attributes;
    const na = now.attributes;
    let sameAttributes = oa.length === na.length;
    for (let i = 0; sameAttributes && i < na.length; i++) sameAttributes = oa[i].name === na[i].name && oa[i].value === na[i].value;
    if (!sameAttributes) {
      for (const a of [...oa]) if (!now.hasAttributeNS(a.namespaceURI, a.localName)) old.removeAttributeNS(a.namespaceURI, a.localName);
      for (const a of na) if (old.getAttributeNS(a.namespaceURI, a.localName) !== a.value) old.setAttributeNS(a.namespaceURI, a.name, a.value);
    }
    const was = [...old.childNodes];
    const is = [...now.childNodes];
    if (was.length !== is.length) { old.replaceChildren(...is); return; }
    is.forEach((n, i) => {
      if (was[i].isEqualNode(n)) return; // the browser's own comparison, far quicker than walking it here
      if (same(was[i], n)) morph(was[i], n); else old.replaceChild(n, was[i]);
    });
  };
  const apply = (replace) => {
    const swaps = [];
    for (const r of replace) {
      const old = document.getElementById(r.id);
      const t = document.createElement('template');
      t.innerHTML = r.html;
      const el = t.content.firstChild;
      if (!old || t.content.childNodes.length !== 1 || !el || el.id !== r.id) return false;
      swaps.push([old, el]);
    }
    const at = anchor();
    for (const [old, el] of swaps) { if (same(old, el)) morph(old, el); else old.replaceWith(el); }
    const now = at && document.getElementById(at.id);
    if (now) window.scrollBy(0, now.getBoundingClientRect().top - at.top);
    return true;
  };
  const update = async () => {
    if (busy) return;
    busy = true;
    try {
      while (wanted !== mine) {
        const r = await fetch('/job/' + encodeURIComponent(job) + '/patch?from=' + mine, { cache: 'no-store' });
        const p = r.ok ? await r.json() : { reload: true };
        if (p.reload || !apply(p.replace)) return reload();
        mine = p.version;
        if (wanted < mine) wanted = mine;
        const line = document.getElementById('ps-draft');
        if (line) line.textContent = p.line;
      }
    } catch {
      reload();
    } finally {
      busy = false;
    }
  };
  es.addEventListener('reload', (e) => {
    let told = null;
    try { told = JSON.parse(e.data); } catch { told = null; }
    if (job && told && told.version === mine) return;
    if (!patching || !told || told.version < 0) return reload();
    wanted = told.version;
    update();
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
