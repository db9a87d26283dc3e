import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { TakeoffRates } from '@latchwork/takeoff';
import { firstValueFrom } from 'rxjs';
import { SHOW_ERROR_SNACKBAR } from '../shell/api-error-interceptor';

/** `GET /api/v1/takeoffs/rates`: the defaults, the firm's overrides, and both combined. */
export interface FirmRates {
  readonly defaults: TakeoffRates;
  readonly overrides: Partial<TakeoffRates>;
  readonly effective: TakeoffRates;
}

/** The firm's takeoff rates at the API. The page computes takeoffs itself, in the browser. */
@Injectable({ providedIn: 'root' })
export class TakeoffApi {
  private readonly http = inject(HttpClient);

  /** The firm's rates; the page handles a failure itself (it falls back to the defaults). */
  rates(): Promise<FirmRates> {
    return firstValueFrom(
      this.http.get<FirmRates>('/api/v1/takeoffs/rates', {
        context: new HttpContext().set(SHOW_ERROR_SNACKBAR, false),
      }),
    );
  }

  /** Replaces the firm's overrides (owner only); answers with the new rates. */
  saveOverrides(overrides: Partial<TakeoffRates>): Promise<FirmRates> {
    return firstValueFrom(
      this.http.put<FirmRates>('/api/v1/takeoffs/rates', overrides, {
        context: new HttpContext().set(SHOW_ERROR_SNACKBAR, false),
      }),
    );
  }
}
