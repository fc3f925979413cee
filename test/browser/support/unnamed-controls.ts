import type { Page } from 'playwright-core';

/** Roles a person operates; each needs a name a screen reader can announce. */
const operableRoles = new Set(['button', 'link', 'textbox', 'combobox', 'checkbox', 'radio', 'switch', 'tab', 'spinbutton', 'slider', 'menuitem', 'option']);

interface AxNode {
  ignored: boolean;
  role?: { value?: string };
  name?: { value?: string };
  properties?: { name: string; value: { value?: unknown } }[];
}

/**
 * Controls on the page without an accessible name, as Chromium's own accessibility tree computes names
 * (labels, aria-label, text content). Each entry is "role (description)"; an empty list means every control
 * is labelled.
 */
export async function unnamedControls(page: Page): Promise<string[]> {
  const session = await page.context().newCDPSession(page);
  try {
    const { nodes } = (await session.send('Accessibility.getFullAXTree')) as { nodes: AxNode[] };
    return nodes
      .filter((node) => !node.ignored && operableRoles.has(node.role?.value ?? '') && !(node.name?.value ?? '').trim())
      .filter((node) => !node.properties?.some((p) => p.name === 'hidden' && p.value.value === true))
      .map((node) => `${node.role?.value}`);
  } finally {
    await session.detach();
  }
}
