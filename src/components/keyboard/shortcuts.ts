/** One line of the shortcut sheet: the keys as typed, and what they do. */
export interface Shortcut {
  keys: readonly string[];
  /** Keys pressed one after the other rather than together (g, then c). */
  sequence?: boolean;
  action: string;
}

export interface ShortcutGroup {
  title: string;
  shortcuts: readonly Shortcut[];
}

/** Where `g` followed by a letter leads. Review is for moderators; the route itself says so to others. */
export const GO_TO: Readonly<Record<string, { path: string; name: string }>> = {
  b: { path: '/', name: 'the Bench' },
  c: { path: '/cases', name: 'Cases' },
  d: { path: '/diagnose', name: 'Diagnose' },
  r: { path: '/review', name: 'the Review desk' },
  l: { path: '/lessons', name: 'Lessons' },
  h: { path: '/help', name: 'Help' },
  p: { path: '/profile', name: 'your profile' },
};

export const SHORTCUT_GROUPS: readonly ShortcutGroup[] = [
  {
    title: 'Anywhere',
    shortcuts: [
      { keys: ['/'], action: 'Put the cursor in this page’s search box (the Bench’s symptom search where the page has none)' },
      { keys: ['n'], action: 'Start a new case' },
      { keys: ['?'], action: 'Show this list' },
      { keys: ['Esc'], action: 'Close this list' },
    ],
  },
  {
    title: 'In a list of cases (the Cases table, search results, the Review desk)',
    shortcuts: [
      { keys: ['j'], action: 'Select the next case' },
      { keys: ['k'], action: 'Select the previous case' },
      { keys: ['Enter'], action: 'Open the selected case' },
    ],
  },
  {
    title: 'Go to',
    shortcuts: Object.entries(GO_TO).map(([key, to]) => ({ keys: ['g', key], sequence: true, action: `Open ${to.name}` })),
  },
];

/** Letters typed into a field are text, never commands. */
export function isTypingTarget(target: EventTarget | null): boolean {
  if (!target || typeof (target as Element).closest !== 'function') return false;
  const el = target as HTMLElement;
  if (el.isContentEditable) return true;
  return el.closest('input, textarea, select, [contenteditable=""], [contenteditable="true"]') !== null;
}

/** Ctrl, Alt and Meta belong to the browser and the system; Shift only makes `?`. */
export function hasCommandModifier(e: Pick<KeyboardEvent, 'ctrlKey' | 'altKey' | 'metaKey'>): boolean {
  return e.ctrlKey || e.altKey || e.metaKey;
}
