// Setup for the `web` vitest project (happy-dom): a canvas for Konva, and a clean slate per test.
import 'vitest-canvas-mock';
import { cleanup } from '@testing-library/react';
import { afterEach, vi } from 'vitest';
import { resetCsrfToken } from '../../src/lib/api-client';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  // The CSRF token lives in module memory; one test's token must not reach the next.
  resetCsrfToken();
});
