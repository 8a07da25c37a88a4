import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useRef, useState } from 'react';
import { caseKeys } from '../api/case-keys';
import { uploadAttachment, type UploadHandle } from '../api/upload-attachment';

export interface UploadItem {
  key: string;
  name: string;
  sizeBytes: number;
  /** 0–1 */
  progress: number;
  state: 'uploading' | 'done' | 'failed';
  error?: string;
}

let counter = 0;

/** Several uploads at once, each with its own progress and error, for one case. */
export function useAttachmentUploads(caseId: number | null, onUploaded?: () => void) {
  const qc = useQueryClient();
  const [items, setItems] = useState<UploadItem[]>([]);
  const handles = useRef(new Map<string, UploadHandle>());
  const patch = (key: string, change: Partial<UploadItem>) => setItems((all) => all.map((i) => (i.key === key ? { ...i, ...change } : i)));

  const start = useCallback(
    (files: File[]) => {
      for (const file of files) {
        const key = `u${++counter}`;
        const item: UploadItem = { key, name: file.name, sizeBytes: file.size, progress: 0, state: 'uploading' };
        if (caseId === null) {
          setItems((all) => [...all, { ...item, state: 'failed', error: 'Give the case a title and a one-line summary first; files attach once the draft is saved.' }]);
          continue;
        }
        setItems((all) => [...all, item]);
        const handle = uploadAttachment(caseId, file, (progress) => patch(key, { progress }));
        handles.current.set(key, handle);
        handle.done
          .then(async () => {
            patch(key, { progress: 1, state: 'done' });
            await qc.invalidateQueries({ queryKey: caseKeys.detail(caseId) });
            void qc.invalidateQueries({ queryKey: caseKeys.lists() });
            onUploaded?.();
            setItems((all) => all.filter((i) => i.key !== key));
          })
          .catch((err: Error) => patch(key, { state: 'failed', error: err.message }))
          .finally(() => handles.current.delete(key));
      }
    },
    [caseId, onUploaded, qc],
  );

  const dismiss = useCallback((key: string) => {
    handles.current.get(key)?.abort();
    setItems((all) => all.filter((i) => i.key !== key));
  }, []);

  return { items, start, dismiss };
}
