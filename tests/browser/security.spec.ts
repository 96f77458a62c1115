// The content security policy as the browser enforces it: the served page has no inline script,
// the policy allows scripts from the server only, and using the product (sign-in, the missions,
// the case library) raises no CSP violation.
import { expect, test } from '@playwright/test';
import { screenshot, signIn } from './session';

test('the app runs under its content security policy without a single violation', async ({ page }) => {
  const violations: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy|Refused to (execute|load|apply)/i.test(message.text())) violations.push(message.text());
  });
  // Runs in the page (the Node-side tsconfig has no DOM types, so it is given as text).
  await page.addInitScript({
    content: "document.addEventListener('securitypolicyviolation', (e) => console.error('Content Security Policy violation: ' + e.violatedDirective + ' ' + e.blockedURI));",
  });

  const response = await page.goto('/sign-in');
  const csp = response?.headers()['content-security-policy'] ?? '';
  expect(/(?:^|;)\s*script-src ([^;]*)/.exec(csp)?.[1]).toBe("'self'");
  const html = (await response?.text()) ?? '';
  // every <script> of the page is loaded from a file; no inline code, no inline event handlers
  const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)];
  expect(scripts.length).toBeGreaterThan(0);
  for (const [, attributes, body] of scripts) {
    expect(attributes).toMatch(/\bsrc=/);
    expect(body?.trim()).toBe('');
  }
  expect(html).not.toMatch(/\son[a-z]+\s*=/i);

  await signIn(page, 'thermal@kestrel.test');
  await page.getByTestId('nav-missions').click();
  await page.getByTestId('nav-cases').click();
  await page.waitForLoadState('networkidle');
  await screenshot(page, 'security-csp-cases');
  expect(violations).toEqual([]);
});
