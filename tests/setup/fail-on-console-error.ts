import { afterEach, beforeEach, vi } from 'vitest';

// An unexpected console.error means something went wrong that no assertion looked at.
let errors: unknown[][] = [];

beforeEach(() => {
  errors = [];
  vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
    errors.push(args);
  });
});

afterEach(() => {
  vi.restoreAllMocks();
  if (errors.length > 0) {
    const first = errors[0]?.map(String).join(' ');
    throw new Error(`Unexpected console.error (${errors.length}): ${first}`);
  }
});
