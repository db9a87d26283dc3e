import {
  DestroyRef,
  InjectionToken,
  Injectable,
  computed,
  effect,
  inject,
  signal,
  untracked,
} from '@angular/core';
import {
  DEFAULT_RATES,
  type Point,
  type TakeoffRates,
  type TakeoffResult,
  computeTakeoff,
  validateTakeoffInput,
} from '@latchwork/takeoff';
import { Session } from '../session/session.store';
import { type FloorDraft, exampleFloor, takeoffInputOf } from './model/floor-draft';
import { loadFloor, saveFloor, storageKey } from './model/floor-storage';
import type { Units } from './model/lengths';
import { type ShownProblem, showProblem } from './model/problem-text';
import { walkFromPoints } from './model/wall-walk';
import { type FirmRates, TakeoffApi } from './takeoff-api';

/** Quiet time after the last edit before recomputing: typing a number is several edits. */
export const RECOMPUTE_DELAY_MS = 120;

/**
 * Where an embedding page keeps its floor between reloads (`key: null`: in memory only). The
 * Takeoff page leaves it out and keeps one scratch floor per firm.
 */
export const FLOOR_STORAGE = new InjectionToken<{ readonly key: string | null }>('FLOOR_STORAGE');

/**
 * The floor being edited and its live takeoff. Edits change `floor` at once; the takeoff is
 * recomputed in the browser with the engine, debounced, outside the input event. While the
 * input is invalid the last good result stays (the page dims it) beside the problems.
 */
@Injectable()
export class FloorEditor {
  private readonly session = inject(Session);
  private readonly api = inject(TakeoffApi);
  private readonly storage = inject(FLOOR_STORAGE, { optional: true });
  private readonly key = this.storage
    ? this.storage.key
    : storageKey(this.session.activeTenant()?.id ?? null);
  private readonly tenantUnits: Units =
    this.session.activeTenant()?.units === 'imperial' ? 'imperial' : 'metric';

  private readonly draft = signal<FloorDraft>(
    (this.key && loadFloor(localStorage, this.key)) || exampleFloor(this.tenantUnits),
  );
  readonly floor = this.draft.asReadonly();
  readonly units = computed(() => this.draft().units);

  /** The firm's rates, or the engine's defaults when they could not be loaded. */
  readonly firmRates = signal<FirmRates | null>(null);
  readonly ratesNote = signal<string | null>(null);
  private readonly rates = computed<TakeoffRates>(
    () => this.firmRates()?.effective ?? { ...DEFAULT_RATES },
  );

  /** The last good takeoff (kept while the input is invalid). */
  readonly result = signal<TakeoffResult | null>(null);
  readonly problems = signal<ShownProblem[]>([]);
  readonly stale = computed(() => this.problems().length > 0);
  /** Milliseconds the last computeTakeoff took in this browser. */
  readonly computeMs = signal<number | null>(null);
  /** How many takeoffs this page has computed (tells one timing from the next). */
  readonly computeRuns = signal(0);

  private timer: ReturnType<typeof setTimeout> | undefined;

  constructor() {
    void this.loadRates();
    effect(() => {
      const floor = this.draft();
      const rates = this.rates();
      untracked(() => this.schedule(floor, rates));
    });
    inject(DestroyRef).onDestroy(() => clearTimeout(this.timer));
  }

  /** Applies an edit to the floor. */
  update(edit: (f: FloorDraft) => FloorDraft): void {
    this.draft.update(edit);
  }

  /** Sets the outline from a tool other than the wall walk (which keeps its own walls). */
  setOutline(outline: Point[], source: FloorDraft['source']): void {
    this.draft.update((f) => ({
      ...f,
      outline,
      source,
      walk: source === 'walls' ? f.walk : walkFromPoints(outline),
    }));
  }

  /** Replaces the whole floor (an embedding page opening a saved floor). */
  load(floor: FloorDraft): void {
    this.draft.set(floor);
  }

  /** Starts again from the example floor, in the firm's units. */
  newFloor(): void {
    this.draft.set(exampleFloor(this.tenantUnits));
  }

  setUnits(units: Units): void {
    this.draft.update((f) => ({ ...f, units }));
  }

  /** Replaces the firm's rate overrides (owner); the takeoff follows. */
  async saveRates(overrides: Partial<TakeoffRates>): Promise<void> {
    this.firmRates.set(await this.api.saveOverrides(overrides));
    this.ratesNote.set(null);
  }

  private async loadRates(): Promise<void> {
    try {
      this.firmRates.set(await this.api.rates());
    } catch {
      this.ratesNote.set(
        'The firm’s rates could not be loaded: this takeoff uses the standard rates.',
      );
    }
  }

  private schedule(floor: FloorDraft, rates: TakeoffRates): void {
    clearTimeout(this.timer);
    this.timer = setTimeout(() => this.recompute(floor, rates), RECOMPUTE_DELAY_MS);
  }

  private recompute(floor: FloorDraft, rates: TakeoffRates): void {
    if (this.key) saveFloor(localStorage, this.key, floor);
    const input = takeoffInputOf(floor, rates);
    const found = validateTakeoffInput(input);
    if (found.length) {
      this.problems.set(found.map((p) => showProblem(p, floor.outline, floor.units)));
      return;
    }
    try {
      const started = performance.now();
      const result = computeTakeoff(input);
      this.computeMs.set(performance.now() - started);
      this.computeRuns.update((n) => n + 1);
      this.result.set(result);
      this.problems.set([]);
      // Slivers: look for an origin that removes them, after the plan has been drawn.
      if (result.cuts.slivers > 0 && floor.origin.mode !== 'auto')
        this.timer = setTimeout(() => this.suggestOrigin(floor, rates), 0);
    } catch (err: unknown) {
      // The validator passed but the engine still refused: say so, keep the last plan.
      const message = err instanceof Error ? err.message : String(err);
      this.problems.set([{ section: 'outline', text: `The takeoff failed: ${message}` }]);
    }
  }

  private suggestOrigin(floor: FloorDraft, rates: TakeoffRates): void {
    if (this.draft() !== floor) return;
    try {
      this.result.set(computeTakeoff(takeoffInputOf(floor, rates, true)));
    } catch {
      // The plain result already shown stands.
    }
  }
}
