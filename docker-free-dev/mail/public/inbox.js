// Inbox page of the mail fake: polls the JSON API, lists messages, shows one at a time.
// The HTML body is shown in a sandboxed iframe served with its own restrictive CSP.
const POLL_MS = 3000;
const $ = (id) => document.getElementById(id);
const state = { messages: [], selected: null, signature: '', filter: '', view: 'html' };
const timeFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'medium' });
const shortTime = new Intl.DateTimeFormat(undefined, {
  hour: '2-digit',
  minute: '2-digit',
  second: '2-digit',
});

const person = (a) => (!a ? '—' : a.name ? `${a.name} <${a.address}>` : a.address);
const people = (list) => (list && list.length ? list.map(person).join(', ') : '');
const size = (bytes) =>
  bytes < 1024
    ? `${bytes} B`
    : bytes < 1024 * 1024
      ? `${(bytes / 1024).toFixed(1)} KB`
      : `${(bytes / 1024 / 1024).toFixed(1)} MB`;

function renderList() {
  const list = $('list');
  list.textContent = '';
  for (const m of state.messages) {
    const button = document.createElement('button');
    button.type = 'button';
    button.className = 'item';
    if (state.selected === m.id) button.setAttribute('aria-current', 'true');

    const top = document.createElement('span');
    top.className = 'item-top';
    const who = document.createElement('span');
    who.className = 'item-to';
    who.textContent = `To ${people(m.to) || m.envelope.to.join(', ') || '—'}`;
    const when = document.createElement('time');
    when.dateTime = m.receivedAt;
    when.textContent = shortTime.format(new Date(m.receivedAt));
    top.append(who, when);

    const subject = document.createElement('span');
    subject.className = 'item-subject';
    subject.textContent = m.subject || '(no subject)';
    const from = document.createElement('span');
    from.className = 'item-from';
    const count = m.attachments.length;
    from.textContent = `From ${person(m.from)}${count ? ` · ${count} attachment${count === 1 ? '' : 's'}` : ''}`;

    button.append(top, subject, from);
    button.addEventListener('click', () => select(m.id));
    const li = document.createElement('li');
    li.append(button);
    list.append(li);
  }
  $('empty').hidden = state.messages.length > 0;
  const n = state.messages.length;
  $('status').textContent =
    `${n} ${n === 1 ? 'message' : 'messages'}${state.filter ? ` to ${state.filter}` : ''}` +
    ' · refreshes every few seconds';
}

function setView(view) {
  state.view = view;
  $('tab-html').setAttribute('aria-selected', String(view === 'html'));
  $('tab-text').setAttribute('aria-selected', String(view === 'text'));
  $('body-html').hidden = view !== 'html';
  $('body-text').hidden = view !== 'text';
}

function renderReader() {
  const m = state.messages.find((x) => x.id === state.selected);
  $('reader').hidden = !m;
  $('placeholder').hidden = Boolean(m);
  document.body.classList.toggle('reading', Boolean(m));
  if (!m) return;
  $('subject').textContent = m.subject || '(no subject)';
  $('from').textContent = person(m.from);
  $('to').textContent = people(m.to) || '—';
  $('cc').textContent = people(m.cc);
  $('cc').hidden = $('cc-label').hidden = !m.cc.length;
  $('bcc').textContent = people(m.bcc);
  $('bcc').hidden = $('bcc-label').hidden = !m.bcc.length;
  $('date').textContent = timeFormat.format(new Date(m.date || m.receivedAt));

  const attachments = $('attachments');
  attachments.textContent = '';
  for (const a of m.attachments) {
    const li = document.createElement('li');
    li.textContent = `${a.filename || '(unnamed)'} — ${a.contentType}, ${size(a.size)}`;
    attachments.append(li);
  }
  attachments.hidden = !m.attachments.length;

  const id = encodeURIComponent(m.id);
  const frame = $('body-html');
  if (frame.getAttribute('src') !== `/api/messages/${id}/html`) {
    frame.setAttribute('src', `/api/messages/${id}/html`);
  }
  $('body-text').textContent = m.text || '(no text part)';
  $('tab-html').disabled = !m.html;
  setView(m.html ? state.view : 'text');
  $('raw').href = `/api/messages/${id}/raw`;
}

function select(id) {
  state.selected = id;
  renderList();
  renderReader();
  $('subject').focus();
}

async function refresh() {
  const url = `/api/messages${state.filter ? `?to=${encodeURIComponent(state.filter)}` : ''}`;
  try {
    const response = await fetch(url, { cache: 'no-store' });
    if (!response.ok) throw new Error(String(response.status));
    const messages = await response.json();
    const signature = messages.map((m) => m.id).join(',');
    if (signature === state.signature) return;
    state.signature = signature;
    state.messages = messages;
    if (state.selected && !messages.some((m) => m.id === state.selected)) state.selected = null;
    renderList();
    renderReader();
  } catch {
    $('status').textContent = 'The mail service is not answering; retrying…';
  }
}

$('subject').tabIndex = -1;
$('tab-html').addEventListener('click', () => setView('html'));
$('tab-text').addEventListener('click', () => setView('text'));
$('back').addEventListener('click', () => {
  state.selected = null;
  renderList();
  renderReader();
});
let debounce;
$('filter').addEventListener('input', (event) => {
  clearTimeout(debounce);
  debounce = setTimeout(() => {
    state.filter = event.target.value.trim();
    state.signature = '';
    refresh();
  }, 250);
});
$('clear').addEventListener('click', async () => {
  if (!window.confirm('Delete every message in this local mailbox?')) return;
  await fetch('/api/messages', { method: 'DELETE' });
  state.signature = '';
  refresh();
});
refresh();
setInterval(() => {
  if (!document.hidden) refresh();
}, POLL_MS);
