// Shared browser set-up and page objects for the end-to-end tests.
import { chromium } from 'playwright-core';

export const BASE = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3000';
export const PASSWORD = 'thaw-demo-2026';
export const USERS = {
  manager: 'manager@frostvale.test',
  operator: 'operator@frostvale.test',
  pilot: 'pilot@frostvale.test',
};

export async function launch() {
  return chromium.launch({
    executablePath: process.env.CHROMIUM || '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run', '--disable-sync'],
  });
}

/** The sign-in page, found by its labels and roles. */
export class SignInPage {
  constructor(page) {
    this.page = page;
  }
  async open() {
    await this.page.goto(`${BASE}/signin`);
  }
  async signIn(email, password = PASSWORD) {
    await this.page.getByLabel('E-mail').fill(email);
    await this.page.getByLabel('Password').fill(password);
    await this.page.getByRole('button', { name: 'Sign in' }).click();
  }
  status() {
    return this.page.getByRole('status');
  }
}

/** The signed-in shell. */
export class Shell {
  constructor(page) {
    this.page = page;
  }
  heading() {
    return this.page.getByRole('heading', { level: 1 });
  }
  async signOut() {
    await this.page.getByRole('button', { name: 'Sign out' }).first().click();
    await this.page.waitForURL(/\/signin/);
  }
}

export async function signedInContext(browser, role, viewport = { width: 1440, height: 900 }) {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  const signin = new SignInPage(page);
  await signin.open();
  await signin.signIn(USERS[role]);
  await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
  return { context, page };
}
