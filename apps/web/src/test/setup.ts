import { cleanup } from '@testing-library/react';
import { afterEach, vi } from 'vitest';
import { forgetCsrfToken } from '@/lib/api-client.ts';

// vitest runs without globals, so Testing Library cannot register its own cleanup.
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  forgetCsrfToken();
});
