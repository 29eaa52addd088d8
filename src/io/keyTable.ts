/** Interned text keys (unit, beam, pol) per key slot: each distinct trimmed text gets one id. */
export class KeyTable {
  readonly names: string[][];
  private readonly maps: Map<string, number>[];

  constructor(slots: number) {
    this.names = Array.from({ length: slots }, () => []);
    this.maps = Array.from({ length: slots }, () => new Map());
  }

  /** Id of `text` in `slot`, or −1 when it is not in the table (nothing is added). */
  find(slot: number, text: string): number {
    return this.maps[slot].get(text) ?? -1;
  }

  /** Id of `text` (already trimmed) in `slot`, adding it when new. */
  intern(slot: number, text: string): number {
    const map = this.maps[slot];
    let id = map.get(text);
    if (id === undefined) {
      id = this.names[slot].length;
      this.names[slot].push(text);
      map.set(text, id);
    }
    return id;
  }
}
