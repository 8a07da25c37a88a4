import { useEffect } from 'react';

/** Calls `onFiles` with files pasted anywhere on the page (a screenshot from the clipboard); text pastes are left alone. */
export function usePasteFiles(onFiles: (files: File[]) => void, enabled = true) {
  useEffect(() => {
    if (!enabled) return;
    const onPaste = (e: ClipboardEvent) => {
      const files = [...(e.clipboardData?.items ?? [])]
        .filter((i) => i.kind === 'file')
        .map((i) => i.getAsFile())
        .filter((f): f is File => f !== null);
      if (files.length === 0) return;
      e.preventDefault();
      const stamp = new Date().toISOString().slice(0, 19).replace(/[:T]/g, '-');
      // clipboard images all arrive as "image.png"; give each a name worth reading in the list
      onFiles(files.map((f, i) => (/^image\.\w+$/.test(f.name) || !f.name ? new File([f], `pasted-${stamp}${files.length > 1 ? `-${i + 1}` : ''}.${f.type.split('/')[1] ?? 'png'}`, { type: f.type }) : f)));
    };
    document.addEventListener('paste', onPaste);
    return () => document.removeEventListener('paste', onPaste);
  }, [enabled, onFiles]);
}
