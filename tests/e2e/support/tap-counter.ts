import type { Locator, Page } from '@playwright/test';

/**
 * Counts what the engineer does (DEVELOPERS.md, Product rules: the visit on a phone): a tap is a click or a
 * focus change (a field focused by tapping it); digits and Enter are keystrokes. Every interaction goes
 * through these helpers, and the page counts trusted pointer-downs and key-downs itself, so a step
 * that bypassed the count would show as a mismatch.
 */
export class TapCounter {
  taps = 0;
  keys = 0;
  private readonly phases: { name: string; taps: number; keys: number }[] = [];

  constructor(private readonly page: Page) {}

  /** Counts in the page from now on (call after signing in, which is not part of the visit). */
  async install(): Promise<void> {
    await this.page.addInitScript(() => {
      const w = window as unknown as { __visitTaps?: number; __visitKeys?: number };
      w.__visitTaps = 0;
      w.__visitKeys = 0;
      document.addEventListener('pointerdown', (e) => e.isTrusted && (w.__visitTaps = (w.__visitTaps ?? 0) + 1), true);
      document.addEventListener('keydown', (e) => e.isTrusted && (w.__visitKeys = (w.__visitKeys ?? 0) + 1), true);
    });
  }

  async tap(target: Locator): Promise<void> {
    this.taps += 1;
    await target.tap();
  }

  /** Keystrokes into the focused field, one per character. */
  async type(text: string): Promise<void> {
    this.keys += text.length;
    await this.page.keyboard.type(text);
  }

  async enter(): Promise<void> {
    this.keys += 1;
    await this.page.keyboard.press('Enter');
  }

  /** A signature: the finger goes down once and draws a few loops; one tap. */
  async sign(box: Locator): Promise<void> {
    this.taps += 1;
    await box.scrollIntoViewIfNeeded();
    const r = (await box.boundingBox())!;
    const { mouse } = this.page;
    await mouse.move(r.x + 20, r.y + r.height * 0.7);
    await mouse.down();
    for (let i = 1; i <= 24; i++) {
      await mouse.move(r.x + 20 + i * ((r.width - 40) / 24), r.y + r.height * (0.5 + 0.3 * Math.sin(i / 2)));
    }
    await mouse.up();
  }

  /** What the page saw since it loaded (the counters survive client-side navigation, not a reload). */
  async seenByPage(): Promise<{ taps: number; keys: number }> {
    return this.page.evaluate(() => {
      const w = window as unknown as { __visitTaps?: number; __visitKeys?: number };
      return { taps: w.__visitTaps ?? 0, keys: w.__visitKeys ?? 0 };
    });
  }

  /** Closes a phase: its counts are what was counted since the last phase closed. */
  phase(name: string): { taps: number; keys: number } {
    const before = this.phases.reduce((n, p) => ({ taps: n.taps + p.taps, keys: n.keys + p.keys }), {
      taps: 0,
      keys: 0,
    });
    const counts = { taps: this.taps - before.taps, keys: this.keys - before.keys };
    this.phases.push({ name, ...counts });
    return counts;
  }

  report(): string {
    return this.phases
      .map((p) => `${p.name.padEnd(34)} ${String(p.taps).padStart(4)} taps ${String(p.keys).padStart(5)} keystrokes`)
      .join('\n');
  }
}
