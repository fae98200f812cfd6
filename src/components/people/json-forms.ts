/**
 * Progressive forms for the people screens: a form marked `data-json-form` is sent as JSON with
 * the method in `data-method` (the browser's form post cannot send PATCH or DELETE), and the
 * server's sentence is shown in its `[data-form-error]`. `data-reload` reloads on success;
 * `data-show-result` shows a field of the answer (the one-time guest link) in `[data-result]`.
 */
function fieldsOf(form: HTMLFormElement): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const el of Array.from(form.elements)) {
    if (!(el instanceof HTMLInputElement || el instanceof HTMLSelectElement || el instanceof HTMLTextAreaElement) || !el.name) continue;
    if (el instanceof HTMLInputElement && el.type === 'checkbox') out[el.name] = el.checked;
    // An empty field is left out, unless it says an empty value means "clear it" (data-keep-empty).
    else if (el.value !== '' || el.dataset.keepEmpty !== undefined) out[el.name] = el.value;
  }
  return out;
}

async function submit(form: HTMLFormElement, event: SubmitEvent) {
  event.preventDefault();
  const method = form.dataset.method ?? 'POST';
  const error = form.querySelector<HTMLElement>('[data-form-error]');
  if (form.dataset.confirm && !window.confirm(form.dataset.confirm)) return;
  if (error) error.textContent = '';
  const body = form.dataset.body ? form.dataset.body : JSON.stringify(fieldsOf(form));
  const res = await fetch(form.action, { method, headers: { 'content-type': 'application/json', accept: 'application/json' }, body: method === 'DELETE' ? undefined : body }).catch(() => null);
  if (!res) {
    if (error) error.textContent = 'No connection to the server; nothing was changed. Try again.';
    return;
  }
  const data = res.status === 204 ? {} : await res.json().catch(() => ({}));
  if (!res.ok) {
    if (error) error.textContent = (data as { error?: string }).error ?? `The server answered ${res.status}.`;
    return;
  }
  const show = form.dataset.showResult;
  if (show) {
    const target = form.querySelector<HTMLElement>('[data-result]');
    const value = show.split('.').reduce<unknown>((v, k) => (v as Record<string, unknown> | undefined)?.[k], data);
    if (target && typeof value === 'string') {
      target.textContent = new URL(value, location.origin).href;
      target.hidden = false;
    }
    return;
  }
  if (form.dataset.redirect) location.assign(form.dataset.redirect);
  else if (form.dataset.reload !== undefined) location.reload();
}

document.addEventListener('submit', (event) => {
  const form = event.target;
  if (form instanceof HTMLFormElement && form.dataset.jsonForm !== undefined) void submit(form, event as SubmitEvent);
});
