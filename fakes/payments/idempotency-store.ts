/** Saved results of POSTs by idempotency key, scoped per API key like the provider's. */
export interface SavedResponse {
  path: string;
  fingerprint: string;
  status: number;
  body: unknown;
  savedAt: number;
}

/** The provider keeps keys for at least 24 hours (from memory). */
const TTL_MS = 24 * 60 * 60 * 1000;

export class IdempotencyStore {
  private saved = new Map<string, SavedResponse>();

  constructor(private readonly maxEntries = 10_000) {}

  get(apiKey: string, key: string): SavedResponse | undefined {
    const id = `${apiKey}\u0000${key}`;
    const entry = this.saved.get(id);
    if (entry && Date.now() - entry.savedAt > TTL_MS) {
      this.saved.delete(id);
      return undefined;
    }
    return entry;
  }

  set(apiKey: string, key: string, entry: Omit<SavedResponse, 'savedAt'>): void {
    this.saved.set(`${apiKey}\u0000${key}`, { ...entry, savedAt: Date.now() });
    while (this.saved.size > this.maxEntries) {
      const oldest = this.saved.keys().next().value;
      if (oldest === undefined) break;
      this.saved.delete(oldest);
    }
  }

  clear(): void {
    this.saved.clear();
  }
}

/** JSON with sorted keys, so the same parameters in another order compare equal. */
export function stableStringify(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableStringify).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableStringify(v)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}
