// The strict content security policy refuses inline handlers (onclick="…"), so the Print buttons
// are wired here, from a bundled script the policy allows.
for (const button of document.querySelectorAll<HTMLButtonElement>('button[data-print]')) {
  button.addEventListener('click', () => window.print());
}
