import type { Page } from 'playwright-core';

/** Drops a text file onto the element, as dragging it from the desktop does (a drop event with a DataTransfer). */
export async function dropFile(page: Page, selector: string, name: string, text: string, type = 'text/csv'): Promise<void> {
  // Written as a string because the Node type check has no DOM library; it runs in the page.
  const transfer = await page.evaluateHandle(`(() => {
    const transfer = new DataTransfer();
    transfer.items.add(new File([${JSON.stringify(text)}], ${JSON.stringify(name)}, { type: ${JSON.stringify(type)} }));
    return transfer;
  })()`);
  await page.dispatchEvent(selector, 'dragenter', { dataTransfer: transfer });
  await page.dispatchEvent(selector, 'drop', { dataTransfer: transfer });
  await transfer.dispose();
}
