// Bench unit page: each value is saved as it is entered (Enter or leaving the field), so a closed tab
// loses nothing already saved; Enter then moves to the next empty reading. Without this script the
// form posts every filled value at once.
(function () {
  const page = document.getElementById('bench-unit');
  if (!page) { return; }
  const csrfToken = document.querySelector('meta[name="_csrf"]');
  const csrfHeader = document.querySelector('meta[name="_csrf_header"]');
  function headers(json) {
    const h = json ? { 'Content-Type': 'application/json', 'Accept': 'application/json' } : { 'Accept': 'application/json' };
    if (csrfToken && csrfHeader) { h[csrfHeader.content] = csrfToken.content; }
    return h;
  }
  const inputs = Array.from(page.querySelectorAll('input.reading-input'));
  const instrument = document.getElementById('instrument');
  const readout = document.getElementById('readout');
  const excitation = document.getElementById('excitation');
  function appliedOf(input) { return input.dataset.applied ? document.getElementById(input.dataset.applied) : null; }

  function statusOf(input) { return document.getElementById(input.id + '-status'); }

  function nextEmpty(from) {
    const start = inputs.indexOf(from);
    for (let i = 1; i <= inputs.length; i++) {
      const candidate = inputs[(start + i) % inputs.length];
      if (!candidate.readOnly && candidate.value.trim() === '') { return candidate; }
    }
    return null;
  }

  async function save(input) {
    const text = input.value.trim();
    if (text === '' || input.readOnly || input.dataset.saving === 'true') { return input.readOnly; }
    const status = statusOf(input);
    input.dataset.saving = 'true';
    status.textContent = '…';
    const body = {
      serial: page.dataset.serial, test: input.dataset.test, point: Number(input.dataset.point),
      direction: input.dataset.direction || null,
      cycle: input.dataset.cycle === '' || input.dataset.cycle === undefined ? null : Number(input.dataset.cycle),
      text: text, instrument: instrument ? instrument.value : null, clientToken: input.dataset.token,
      applied: appliedOf(input) ? appliedOf(input).value.trim() : null,
      readout: readout ? readout.value : null, excitation: excitation ? excitation.value : null
    };
    try {
      const response = await fetch(page.dataset.autosave, { method: 'POST', headers: headers(true), body: JSON.stringify(body),
        credentials: 'same-origin' });
      if (response.ok) {
        const saved = await response.json();
        input.readOnly = true;
        input.value = saved.value + ' ' + saved.unit;
        if (appliedOf(input)) { appliedOf(input).readOnly = true; appliedOf(input).value = saved.applied; }
        input.classList.remove('invalid');
        input.removeAttribute('aria-invalid');
        status.textContent = 'saved ✓';
        return true;
      }
      let detail = 'not saved (' + response.status + ')';
      try { detail = (await response.json()).detail || detail; } catch (e) { /* not JSON */ }
      status.textContent = detail;
      input.classList.add('invalid');
      input.setAttribute('aria-invalid', 'true');
      return false;
    } catch (e) {
      status.textContent = 'not saved: no connection. The value is kept here; press Enter to retry.';
      return false;
    } finally {
      input.dataset.saving = 'false';
    }
  }

  // Enter in an applied-value field moves on to its reading (saving happens with the reading).
  inputs.forEach(input => {
    const applied = appliedOf(input);
    if (!applied) { return; }
    applied.addEventListener('keydown', event => {
      if (event.key !== 'Enter') { return; }
      event.preventDefault();
      input.focus();
    });
  });

  inputs.forEach(input => {
    input.addEventListener('keydown', async event => {
      if (event.key !== 'Enter') { return; }
      event.preventDefault();
      const ok = await save(input);
      if (ok) {
        const next = nextEmpty(input);
        if (next) { next.focus(); } else { document.getElementById('save-readings').focus(); }
      }
    });
    input.addEventListener('change', () => { save(input); });
  });

  // Import: run as a background job and show its progress.
  const form = document.getElementById('import-form');
  if (form && window.FormData) {
    form.addEventListener('submit', async event => {
      event.preventDefault();
      const submitter = event.submitter;
      const data = new FormData(form);
      data.set('preview', submitter && submitter.value === 'true' ? 'true' : 'false');
      const bar = document.getElementById('import-progress');
      const result = document.getElementById('import-result');
      bar.hidden = false; bar.value = 0; result.textContent = '';
      const started = await fetch(page.dataset.jobs, { method: 'POST', headers: headers(false), body: data, credentials: 'same-origin' });
      if (!started.ok) {
        let detail = 'The import could not start (' + started.status + ').';
        try { detail = (await started.json()).detail || detail; } catch (e) { /* not JSON */ }
        result.textContent = detail; bar.hidden = true; return;
      }
      let job = await started.json();
      while (job.state === 'RUNNING') {
        bar.value = job.bytesTotal > 0 ? Math.min(99, 100 * job.bytesRead / job.bytesTotal) : 0;
        await new Promise(r => setTimeout(r, 500));
        const polled = await fetch(page.dataset.jobStatus + job.id, { headers: headers(false), credentials: 'same-origin' });
        job = await polled.json();
      }
      bar.value = 100;
      if (job.state === 'FAILED') { result.textContent = job.failure; return; }
      const o = job.outcome;
      if (o.errorCount > 0) {
        result.textContent = o.errorCount + ' error(s), nothing saved: ' + o.errors.slice(0, 10).join(' · ');
      } else if (o.preview) {
        result.textContent = 'The file is valid: ' + o.validRows + ' readings would be imported. Nothing was saved.';
      } else {
        result.textContent = o.validRows + ' readings imported.';
        setTimeout(() => window.location.reload(), 1200);
      }
    });
  }
})();
