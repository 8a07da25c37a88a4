// Runs before first paint so a dark-theme reader never sees a light flash.
(function () {
  try {
    var choice = localStorage.getItem('ft.theme') || 'system';
    var dark = choice === 'dark' || (choice === 'system' && window.matchMedia('(prefers-color-scheme: dark)').matches);
    document.documentElement.classList.toggle('dark', dark);
  } catch (e) {}
})();
