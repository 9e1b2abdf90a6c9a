/**
 * The job sheet's fields save themselves: each field (or pair, like a reading's top and bottom) is a
 * slot holding what is typed, sent as one small idempotent PUT once it is valid (after a short pause,
 * or at once on Enter or leaving the field). The slots live for the page, not the component, so a
 * radiator's card can close with a save in flight or a half-typed reading, and the completion guard
 * can still see it ("unsaved input on the page"). What is typed and not yet saved is also handed to `persist` (the
 * page keeps it as a draft on the phone) and comes back through `seed` after a reload or a closed tab; a send kept
 * in the phone's queue for lack of signal counts as saved ("kept"), since the queue holds it until the server has it.
 */

export type SlotStatus =
  /** Nothing typed beyond what is saved. */
  | 'saved'
  /** Valid, waiting for the pause to end. */
  | 'pending'
  | 'saving'
  /** Something typed that cannot be saved yet: a reading with only one of its two numbers. */
  | 'incomplete'
  /** A figure the schema refuses (out of range, not a number). */
  | 'invalid'
  | 'failed';

export type Parsed<I> = { ok: true; input: I } | { ok: false; empty: boolean; errors: Record<string, string> };

export interface SlotView<D> {
  draft: D;
  status: SlotStatus;
  errors: Record<string, string>;
  /** The API's message when the last send failed. */
  failure: string | null;
  /** When this page last saved the slot (ms since the epoch), for the saved mark. */
  savedAt: number | null;
  /** The API holds a value for the slot (saved here or before). */
  stored: boolean;
  /** The last save is kept in the phone's queue, waiting for signal. */
  kept: boolean;
}

export interface SlotOptions<D, I> {
  /** Words for the completion summary, e.g. "Radiator 3, Lounge: before reading". */
  label: string;
  parse: (draft: D) => Parsed<I>;
  /** Resolves when the value is safe: sent, or 'kept' in the phone's queue until there is signal. */
  send: (input: I) => Promise<void | 'kept'>;
  /** The input as the API holds it now, or null when nothing is saved. */
  savedInput: I | null;
  delayMs?: number;
}

interface Slot<D, I> {
  view: SlotView<D>;
  options: SlotOptions<D, I>;
  savedJson: string | null;
  inFlight: Promise<void> | null;
  again: boolean;
  timer: ReturnType<typeof setTimeout> | null;
}

export interface UnsavedSlot {
  key: string;
  label: string;
  status: SlotStatus;
}

const UNSAVED: ReadonlySet<SlotStatus> = new Set(['pending', 'saving', 'incomplete', 'invalid', 'failed']);

export class AutosaveStore {
  // Slots are typed per call site; the map holds them erased.
  private slots = new Map<string, Slot<unknown, unknown>>();
  private listeners = new Set<() => void>();
  private unsavedList: UnsavedSlot[] = [];
  private seeds = new Map<string, unknown>();

  constructor(private readonly persist?: (drafts: Record<string, unknown>) => void) {}

  /** Drafts kept on the phone from an earlier page: back into their fields, and sent if they are valid. */
  seed(drafts: Record<string, unknown>): void {
    for (const [key, draft] of Object.entries(drafts)) {
      if (this.slots.has(key)) this.edit(key, draft);
      else this.seeds.set(key, draft);
    }
  }

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  /** The slots holding input that is not saved, for the completion guard (a stable array between changes). */
  unsaved = (): UnsavedSlot[] => this.unsavedList;

  /** Creates the slot the first time; later calls only refresh how it parses and sends. */
  slot<D, I>(key: string, initialDraft: D, options: SlotOptions<D, I>): void {
    const existing = this.slots.get(key) as Slot<D, I> | undefined;
    if (existing) {
      existing.options = options;
      return;
    }
    const seeded = this.seeds.has(key);
    const slot: Slot<D, I> = {
      view: {
        draft: seeded ? (this.seeds.get(key) as D) : initialDraft,
        status: 'saved',
        errors: {},
        failure: null,
        savedAt: null,
        stored: options.savedInput !== null,
        kept: false,
      },
      options,
      savedJson: options.savedInput === null ? null : JSON.stringify(options.savedInput),
      inFlight: null,
      again: false,
      timer: null,
    };
    this.slots.set(key, slot as Slot<unknown, unknown>);
    if (seeded) {
      this.seeds.delete(key);
      // Judged and sent after this render, as if just typed.
      queueMicrotask(() => this.edit(key, slot.view.draft));
    }
  }

  view<D>(key: string): SlotView<D> | undefined {
    return this.slots.get(key)?.view as SlotView<D> | undefined;
  }

  /** What was typed: judged at once, sent after the pause if it is valid and differs from what is saved. */
  edit<D>(key: string, draft: D): void {
    const slot = this.slots.get(key);
    if (!slot) return;
    slot.view = { ...slot.view, draft, failure: null };
    this.judge(slot);
    if (slot.view.status === 'pending') {
      if (slot.timer) clearTimeout(slot.timer);
      slot.timer = setTimeout(() => void this.flush(key), slot.options.delayMs ?? 800);
    }
    this.changed();
  }

  /** The draft is what the server holds now (the engineer kept another person's value): shown as saved, not sent. */
  settle<D>(key: string, draft: D): void {
    const slot = this.slots.get(key);
    if (!slot) return;
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = null;
    const parsed = slot.options.parse(draft);
    slot.savedJson = parsed.ok ? JSON.stringify(parsed.input) : slot.savedJson;
    slot.view = { ...slot.view, draft, failure: null, kept: false };
    this.judge(slot);
    this.changed();
  }

  /** Sends now if there is something valid to send (Enter, leaving the field, completing the job). */
  flush(key: string): Promise<void> {
    const slot = this.slots.get(key);
    if (!slot) return Promise.resolve();
    if (slot.timer) {
      clearTimeout(slot.timer);
      slot.timer = null;
    }
    if (slot.inFlight) {
      slot.again = true;
      return slot.inFlight;
    }
    const parsed = slot.options.parse(slot.view.draft);
    if (!parsed.ok) return Promise.resolve();
    const json = JSON.stringify(parsed.input);
    if (json === slot.savedJson && slot.view.status !== 'failed') return Promise.resolve();
    slot.view = { ...slot.view, status: 'saving', failure: null };
    this.changed();
    slot.inFlight = slot.options
      .send(parsed.input)
      .then(
        (outcome) => {
          slot.savedJson = json;
          slot.view = { ...slot.view, savedAt: Date.now(), stored: true, kept: outcome === 'kept' };
          this.judge(slot);
        },
        (error: unknown) => {
          slot.view = {
            ...slot.view,
            status: 'failed',
            failure: error instanceof Error ? error.message : 'The save failed.',
          };
          slot.again = false;
        },
      )
      .finally(() => {
        slot.inFlight = null;
        this.changed();
        if (slot.again) {
          slot.again = false;
          void this.flush(key);
        }
      });
    return slot.inFlight;
  }

  /** Every slot sent that can be, and every send settled: what completing waits for. */
  async flushAll(): Promise<void> {
    await Promise.all([...this.slots.keys()].map((key) => this.flush(key)));
    const still = [...this.slots.values()].map((s) => s.inFlight).filter(Boolean);
    if (still.length) await Promise.all(still);
  }

  private judge(slot: Slot<unknown, unknown>): void {
    const parsed = slot.options.parse(slot.view.draft);
    if (parsed.ok) {
      const same = JSON.stringify(parsed.input) === slot.savedJson;
      slot.view = { ...slot.view, errors: {}, status: same ? 'saved' : 'pending' };
    } else if (parsed.empty && slot.savedJson === null) {
      slot.view = { ...slot.view, errors: {}, status: 'saved' };
    } else {
      const invalid = Object.keys(parsed.errors).length > 0;
      slot.view = { ...slot.view, errors: parsed.errors, status: invalid ? 'invalid' : 'incomplete' };
    }
  }

  private changed(): void {
    const next: UnsavedSlot[] = [];
    for (const [key, slot] of this.slots) {
      if (UNSAVED.has(slot.view.status)) next.push({ key, label: slot.options.label, status: slot.view.status });
    }
    const same =
      next.length === this.unsavedList.length &&
      next.every((s, i) => s.key === this.unsavedList[i]!.key && s.status === this.unsavedList[i]!.status);
    if (!same) this.unsavedList = next;
    if (this.persist) {
      const drafts: Record<string, unknown> = {};
      for (const { key } of next) drafts[key] = this.slots.get(key)!.view.draft;
      this.persist(drafts);
    }
    for (const listener of this.listeners) listener();
  }
}
