/** A list the j/k/Enter keys can walk: the Cases table, search results, the Review desk. */
export interface KeyboardList {
  /** The element holding the rows; a list that is not on screen is skipped. */
  container: () => Element | null;
  move: (delta: 1 | -1) => void;
  /** Opens the selected row; false when no row is selected. */
  open: () => boolean;
}

const lists: KeyboardList[] = [];

/** Registers a list; the latest one on screen gets the keys. Returns the unregister function. */
export function registerList(list: KeyboardList): () => void {
  lists.push(list);
  return () => {
    const i = lists.indexOf(list);
    if (i >= 0) lists.splice(i, 1);
  };
}

export function activeList(): KeyboardList | undefined {
  for (let i = lists.length - 1; i >= 0; i--) {
    const el = lists[i].container();
    if (el && el.isConnected && el.getClientRects().length > 0) return lists[i];
  }
  return undefined;
}
