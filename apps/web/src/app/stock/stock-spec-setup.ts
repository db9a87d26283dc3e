import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Type } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { meOf } from '../session/me-fixture';
import { Session } from '../session/session.store';

/** A stock page opened at `url` for a stores person, with the HTTP backend under the test's hand. */
export interface StockPageUnderTest {
  readonly backend: HttpTestingController;
  readonly harness: RouterTestingHarness;
  /** The page's element. */
  el(): HTMLElement;
  /** Lets timers, requests and change detection settle. */
  settle(ms?: number): Promise<void>;
  /** Types into an input as a person would (value, then the input event). */
  type(input: HTMLInputElement | null | undefined, text: string): void;
}

/**
 * Test set-up shared by the stock pages' specs (used by specs only): signs in a stores person
 * (stock:read + stock:write) and routes `path` to `page`, then opens `url`.
 */
export async function openStockPage(
  path: string,
  page: Type<unknown>,
  url: string,
): Promise<StockPageUnderTest> {
  TestBed.configureTestingModule({
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      provideRouter([{ path, component: page }]),
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
    ],
  });
  const backend = TestBed.inject(HttpTestingController);
  const loaded = TestBed.inject(Session).load();
  backend.expectOne('/api/v1/me').flush(meOf('stores', ['stock:read', 'stock:write']));
  await loaded;
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url, page);
  return {
    backend,
    harness,
    el: () => harness.routeNativeElement as HTMLElement,
    settle: async (ms = 0) => {
      await new Promise((resolve) => setTimeout(resolve, ms));
      await harness.fixture.whenStable();
    },
    type: (input, text) => {
      if (!input) throw new Error('no such input');
      input.value = text;
      input.dispatchEvent(new Event('input'));
    },
  };
}
