import { expect, test } from '@playwright/test';

/**
 * For every test of the enclosing describe block: records each request the page makes and every
 * page error or console error (a Content-Security-Policy refusal among them), and afterwards fails the test if a request left 127.0.0.1 (data:
 * and blob: URLs stay in the page) or the page reported an error. Returns the request log, which
 * a test may read too.
 */
export function guardEveryPage(): { requests: string[] } {
  const requests: string[] = [];
  const problems: string[] = [];
  test.beforeEach(async ({ page }) => {
    requests.length = 0;
    problems.length = 0;
    page.on('request', (request) => requests.push(request.url()));
    page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
    page.on('console', (message) => {
      if (message.type() === 'error') problems.push(`console: ${message.text()}`);
    });
  });
  test.afterEach(() => {
    const outside = requests.filter((url) => {
      const { protocol, hostname } = new URL(url);
      return !(protocol === 'data:' || protocol === 'blob:' || hostname === '127.0.0.1');
    });
    expect(outside, 'no request may leave 127.0.0.1').toEqual([]);
    expect(problems).toEqual([]);
  });
  return { requests };
}
