// Paged segment lists are read far more often than segments change: answers
// are kept per agency and query, and every write to an agency's segments or
// surveys bumps its generation so no stale page is ever served.
const MAX_ENTRIES = 2000;

export class ListCache {
  private generation = new Map<string, number>();
  private entries = new Map<string, string>();

  key(agencyId: string, query: unknown) {
    return `${agencyId}|${this.generation.get(agencyId) ?? 0}|${JSON.stringify(query)}`;
  }

  get(key: string) {
    return this.entries.get(key);
  }

  set(key: string, json: string) {
    if (this.entries.size >= MAX_ENTRIES) this.entries.clear();
    this.entries.set(key, json);
  }

  /** Call after any change to the agency's segments or surveys. */
  bump(agencyId: string) {
    this.generation.set(agencyId, (this.generation.get(agencyId) ?? 0) + 1);
    for (const k of this.entries.keys()) if (k.startsWith(`${agencyId}|`)) this.entries.delete(k);
  }
}
