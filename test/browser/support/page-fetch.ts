import type { Page } from 'playwright-core';

export interface PageAnswer {
  status: number;
  body: unknown;
}

/**
 * A request made by the page itself (its cookies, its origin), as a user could forge it from the browser's
 * console. Written as a string because the Node type check has no DOM library; it runs in the page.
 */
export function fetchFromPage(page: Page, method: string, path: string, body: unknown, headers: Record<string, string>): Promise<PageAnswer> {
  const script = `(async () => {
    const response = await fetch(${JSON.stringify(path)}, {
      method: ${JSON.stringify(method)},
      headers: ${JSON.stringify({ 'Content-Type': 'application/json', ...headers })},
      body: ${JSON.stringify(JSON.stringify(body))},
    });
    const text = await response.text();
    let parsed = null;
    try { parsed = JSON.parse(text); } catch { parsed = text; }
    return { status: response.status, body: parsed };
  })()`;
  return page.evaluate<PageAnswer>(script);
}
