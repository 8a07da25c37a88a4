import { useEffect, useState } from 'react';

type Theme = 'system' | 'light' | 'dark';
const NEXT: Record<Theme, Theme> = { system: 'light', light: 'dark', dark: 'system' };
const LABEL: Record<Theme, string> = { system: 'Theme: system', light: 'Theme: light', dark: 'Theme: dark' };

function apply(theme: Theme) {
  const dark = theme === 'dark' || (theme === 'system' && window.matchMedia('(prefers-color-scheme: dark)').matches);
  document.documentElement.classList.toggle('dark', dark);
}

export function ThemeToggle() {
  const [theme, setTheme] = useState<Theme>(() => (localStorage.getItem('ft.theme') as Theme | null) ?? 'system');
  useEffect(() => {
    localStorage.setItem('ft.theme', theme);
    apply(theme);
  }, [theme]);
  return (
    <button
      type="button"
      onClick={() => setTheme(NEXT[theme])}
      className="rounded-md border border-rule px-2 py-1 text-xs text-muted hover:text-ink"
      title="Switch between the system, light and dark themes"
    >
      {LABEL[theme]}
    </button>
  );
}
