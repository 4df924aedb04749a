// Small progressive enhancements; every page works without them.
document.addEventListener('DOMContentLoaded', () => {
  // A form marked data-once disables its submit buttons after the first submit (double-submit guard).
  document.querySelectorAll('form[data-once]').forEach(form => {
    form.addEventListener('submit', () => {
      form.querySelectorAll('button[type=submit]').forEach(b => { b.disabled = true; });
    });
  });
});
