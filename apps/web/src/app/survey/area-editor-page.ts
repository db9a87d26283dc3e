import {
  ChangeDetectionStrategy,
  Component,
  ViewEncapsulation,
  computed,
  inject,
  signal,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { DEFAULT_RATES } from '@latchwork/takeoff';
import { errorText } from '../api/api-problems';
import { Session } from '../session/session.store';
import { FLOOR_STORAGE, FloorEditor } from '../takeoff/floor-editor.store';
import { FloorWorkbench } from '../takeoff/floor-workbench';
import { UnitsToggle } from '../takeoff/units-toggle';
import { exampleFloor, takeoffInputOf } from '../takeoff/model/floor-draft';
import type { Units } from '../takeoff/model/lengths';
import { draftFromInput } from './model/draft-from-input';
import { type SurveyArea, SurveyApi } from './survey-api';

/**
 * One survey area in the floor editor (route /jobs/:jobId/areas/:areaId): opens the latest
 * saved version, or a starting floor for a new area, and saves the edit as the next version.
 * The server computes the saved version again with the firm's rates; the page's live figures
 * come from the same engine in the browser.
 */
@Component({
  selector: 'lw-area-editor-page',
  imports: [FloorWorkbench, MatButton, MatIcon, RouterLink, UnitsToggle],
  // In memory only: the saved versions are the record, and a stale local copy would confuse.
  providers: [FloorEditor, { provide: FLOOR_STORAGE, useValue: { key: null } }],
  templateUrl: './area-editor-page.html',
  // Not encapsulated for the one rule that gives the page the frame's full width.
  styleUrl: './area-editor-page.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AreaEditorPage {
  private readonly api = inject(SurveyApi);
  private readonly session = inject(Session);
  protected readonly editor = inject(FloorEditor);
  private readonly params = inject(ActivatedRoute).snapshot.paramMap;
  protected readonly jobId = this.params.get('jobId') ?? '';
  private readonly areaId = this.params.get('areaId') ?? '';

  protected readonly area = signal<SurveyArea | null>(null);
  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly saving = signal(false);
  protected readonly savedVersion = signal<number | null>(null);
  protected readonly canSave = computed(() => this.session.can('takeoffs:write'));
  protected readonly blocked = computed(() => this.editor.problems().length > 0);

  constructor() {
    void this.open();
  }

  private get units(): Units {
    return this.session.activeTenant()?.units === 'imperial' ? 'imperial' : 'metric';
  }

  private async open(): Promise<void> {
    try {
      const view = await this.api.survey(this.jobId);
      const area = view.areas.find((a) => a.id === this.areaId);
      if (!area) {
        this.problem.set('This area is not part of the job’s survey any more.');
        return;
      }
      this.area.set(area);
      if (area.latest) {
        const saved = await this.api.version(this.jobId, area.id, area.latest.version);
        if (saved.input) this.editor.load(draftFromInput(saved.input, area.name, this.units));
      } else {
        this.editor.load({ ...exampleFloor(this.units), name: area.name });
      }
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    } finally {
      this.loading.set(false);
    }
  }

  /** Saves the floor as the area's next version; the firm's rates apply on the server. */
  protected async save(): Promise<void> {
    const area = this.area();
    if (!area || this.blocked()) return;
    this.problem.set(null);
    this.saving.set(true);
    try {
      const {
        rates: _rates,
        suggestOrigin: _suggest,
        ...input
      } = takeoffInputOf(this.editor.floor(), DEFAULT_RATES);
      const saved = await this.api.saveVersion(this.jobId, area.id, input);
      this.savedVersion.set(saved.version);
    } catch (err: unknown) {
      this.problem.set(errorText(err));
    } finally {
      this.saving.set(false);
    }
  }
}
