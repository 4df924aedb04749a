// Small progressive enhancements; every page works without them.
document.addEventListener('DOMContentLoaded', () => {
  // A form marked data-once disables its submit buttons after the first submit (double-submit guard).
  document.querySelectorAll('form[data-once]').forEach(form => {
    form.addEventListener('submit', () => {
      form.querySelectorAll('button[type=submit]').forEach(b => { b.disabled = true; });
    });
  });
  // A form shown again with errors: the keyboard starts at the first field that needs correcting.
  const invalid = document.querySelector('form [aria-invalid="true"]');
  if (invalid) {
    invalid.focus();
  }
});
