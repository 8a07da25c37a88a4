import type { Page } from 'playwright-core';

/** Drops a text file on the case form's attachment zone, as a drag from the desktop would. */
export async function dropFile(page: Page, name: string, text: string) {
  const dataTransfer = await page.evaluateHandle(
    ([n, t]) => {
      const dt = new DataTransfer();
      dt.items.add(new File([t], n, { type: 'text/csv' }));
      return dt;
    },
    [name, text],
  );
  await page.getByTestId('drop-zone').dispatchEvent('dragover', { dataTransfer });
  await page.getByTestId('drop-zone').dispatchEvent('drop', { dataTransfer });
}

/** Waits until the form's autosave says it saved. */
export const saved = (page: Page) => page.getByTestId('autosave-status').getByText(/^Saved \d/).waitFor();
