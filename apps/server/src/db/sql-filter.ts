/**
 * Builds the WHERE clause of a list query with bind parameters ($1, $2…), always starting
 * with the organization filter, so that a list can never forget its tenant (row-level
 * security would hide other organizations' rows anyway).
 */
export class SqlFilter {
  readonly bind: unknown[];
  private readonly conditions: string[];

  constructor(orgId: string, orgColumn: string) {
    this.bind = [orgId];
    this.conditions = [`${orgColumn} = $1`];
  }

  /** Adds a bind parameter and returns its placeholder. */
  param = (value: unknown): string => {
    this.bind.push(value);
    return `$${this.bind.length}`;
  };

  /** Adds a condition written with placeholders from `param`. */
  add(condition: (param: (value: unknown) => string) => string): void {
    this.conditions.push(condition(this.param));
  }

  sql(): string {
    return `WHERE ${this.conditions.join(' AND ')}`;
  }
}

/** An ILIKE pattern matching `text` anywhere, with LIKE's wildcards in it taken literally. */
export function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
