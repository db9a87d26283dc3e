import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import type {
  EmissionUnit,
  LimitRule,
  ReadingKind,
  ReadingStatus,
  SlabLimits,
  SurveyWarning,
} from '@latchwork/jobs-domain';
import type { TakeoffInput, TakeoffResult } from '@latchwork/takeoff';
import { firstValueFrom } from 'rxjs';
import { SHOW_ERROR_SNACKBAR } from '../shell/api-error-interceptor';

export type Substrate = 'concrete' | 'screed' | 'asphalt' | 'timber' | 'existing_floor';

export const SUBSTRATE_LABELS: Readonly<Record<Substrate, string>> = {
  concrete: 'Concrete',
  screed: 'Screed',
  asphalt: 'Asphalt',
  timber: 'Timber',
  existing_floor: 'Existing floor',
};

/** What a saved version keeps of the engine's result: everything but the drawing. */
export type TakeoffSummary = Omit<TakeoffResult, 'plan'>;

export interface SurveyDetails {
  readonly substrate: Substrate | null;
  /** ISO date-time. */
  readonly surveyedAt: string | null;
  readonly surveyorUserId: string | null;
  readonly notes: string;
}

export interface SurveyArea {
  readonly id: string;
  readonly name: string;
  readonly latest: { version: number; summary: TakeoffSummary; createdAt: string } | null;
}

export interface SavedReading {
  readonly id: string;
  readonly kind: ReadingKind;
  readonly method: string;
  readonly value: number;
  readonly unit: EmissionUnit | null;
  readonly location: string;
  readonly takenAt: string;
  /** Judged by the firm's limits as they are now. */
  readonly status: ReadingStatus;
  readonly message: string;
  readonly source: string;
}

/** `GET /jobs/:jobId/survey`. */
export interface JobSurveyView {
  readonly jobId: string;
  readonly survey: (SurveyDetails & { id: string }) | null;
  readonly areas: readonly SurveyArea[];
  readonly readings: readonly SavedReading[];
  readonly limits: SlabLimits;
  readonly surveyWarnings: readonly SurveyWarning[];
  readonly caution: string;
}

export interface NewReading {
  readonly kind: ReadingKind;
  readonly method: string;
  readonly value: number;
  readonly unit?: EmissionUnit;
  readonly location: string;
  readonly takenAt: string;
}

export interface TakeoffVersion {
  readonly id: string;
  readonly version: number;
  readonly summary: TakeoffSummary;
  readonly createdAt: string;
  readonly input?: TakeoffInput;
}

export interface LimitsView {
  readonly defaults: SlabLimits;
  readonly overrides: Partial<Record<ReadingKind, Partial<LimitRule>>>;
  readonly effective: SlabLimits;
}

/**
 * The survey endpoints. Writes go without the global error snackbar: the forms show the
 * refusal (a field problem, a duplicate area name) beside what the person did.
 */
@Injectable({ providedIn: 'root' })
export class SurveyApi {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: new HttpContext().set(SHOW_ERROR_SNACKBAR, false) };
  /** Bumped after a reading changes, so the job header's banner reloads its warnings. */
  readonly readingsChanged = signal(0);
  private readonly base = (jobId: string) => `/api/v1/jobs/${encodeURIComponent(jobId)}/survey`;

  survey(jobId: string): Promise<JobSurveyView> {
    return firstValueFrom(this.http.get<JobSurveyView>(this.base(jobId)));
  }

  /** The survey without the global snackbar: the job header's banner stays quiet on failure. */
  surveyQuietly(jobId: string): Promise<JobSurveyView> {
    return firstValueFrom(this.http.get<JobSurveyView>(this.base(jobId), this.quiet));
  }

  saveDetails(jobId: string, details: SurveyDetails): Promise<unknown> {
    return firstValueFrom(this.http.put(this.base(jobId), details, this.quiet));
  }

  addArea(jobId: string, name: string): Promise<SurveyArea> {
    return firstValueFrom(
      this.http.post<SurveyArea>(`${this.base(jobId)}/areas`, { name }, this.quiet),
    );
  }

  versions(jobId: string, areaId: string): Promise<TakeoffVersion[]> {
    return firstValueFrom(
      this.http.get<TakeoffVersion[]>(`${this.base(jobId)}/areas/${areaId}/versions`),
    );
  }

  version(jobId: string, areaId: string, version: number): Promise<TakeoffVersion> {
    return firstValueFrom(
      this.http.get<TakeoffVersion>(`${this.base(jobId)}/areas/${areaId}/versions/${version}`),
    );
  }

  saveVersion(jobId: string, areaId: string, input: TakeoffInput): Promise<TakeoffVersion> {
    return firstValueFrom(
      this.http.post<TakeoffVersion>(
        `${this.base(jobId)}/areas/${areaId}/versions`,
        input,
        this.quiet,
      ),
    );
  }

  addReading(jobId: string, reading: NewReading): Promise<SavedReading> {
    return firstValueFrom(
      this.http.post<SavedReading>(`${this.base(jobId)}/readings`, reading, this.quiet),
    );
  }

  deleteReading(jobId: string, readingId: string): Promise<unknown> {
    return firstValueFrom(
      this.http.delete(`${this.base(jobId)}/readings/${readingId}`, this.quiet),
    );
  }
}
