// The installation as a tree: each board is fed from the origin or by a circuit of another board
// (`boards[].fed_by: BOARD/REF`). Pure: the problems of a tree (a missing feeding circuit, a loop)
// are found here and reported by validation as input errors; `boardOrder` gives the boards from
// the origin down, each after the board that feeds it.

export interface Feed {
  board: string;
  ref: string;
}

export interface TreeBoard {
  id: string;
  fed_by?: string | undefined;
}

/** "DB1/4" → { board: 'DB1', ref: '4' }; null when it is not BOARD/REF. */
export function parseFeed(text: string): Feed | null {
  const i = text.indexOf('/');
  if (i <= 0 || i === text.length - 1) return null;
  const board = text.slice(0, i).trim();
  const ref = text.slice(i + 1).trim();
  return board && ref ? { board, ref } : null;
}

export const feedKey = (f: Feed): string => `${f.board}/${f.ref}`;

export interface TreeProblem {
  /** index of the board in project.yaml's boards */
  index: number;
  message: string;
}

/**
 * Every problem of the tree at once: a feed not written as BOARD/REF, a feeding board or circuit
 * that does not exist, one circuit feeding two boards, a board fed by its own circuit or a loop.
 * `circuits` holds the BOARD/REF keys of circuits.csv.
 */
export function treeProblems(boards: readonly TreeBoard[], circuits: ReadonlySet<string>): TreeProblem[] {
  const problems: TreeProblem[] = [];
  const ids = new Set(boards.map((b) => b.id));
  const parent = new Map<string, string>();
  const fedFrom = new Map<string, string>();
  boards.forEach((b, index) => {
    if (b.fed_by === undefined) return;
    const feed = parseFeed(b.fed_by);
    if (!feed) {
      problems.push({ index, message: `fed_by: found "${b.fed_by}"; expected the feeding circuit as BOARD/REF, e.g. DB1/4` });
      return;
    }
    if (!ids.has(feed.board)) {
      problems.push({ index, message: `fed_by: board "${feed.board}" is not listed under boards (listed: ${[...ids].join(', ')})` });
      return;
    }
    if (!circuits.has(feedKey(feed))) {
      problems.push({ index, message: `fed_by: no circuit ${feed.ref} on board ${feed.board} in circuits.csv; list the circuit that feeds ${b.id} there` });
      return;
    }
    const other = fedFrom.get(feedKey(feed));
    if (other !== undefined) {
      problems.push({ index, message: `fed_by: circuit ${feedKey(feed)} already feeds ${other}; one circuit feeds one board` });
      return;
    }
    fedFrom.set(feedKey(feed), b.id);
    parent.set(b.id, feed.board);
  });
  boards.forEach((b, index) => {
    const seen = [b.id];
    let at = parent.get(b.id);
    while (at !== undefined) {
      if (at === b.id) {
        problems.push({ index, message: `fed_by: ${[...seen, b.id].join(' → ')} is a loop; a board must be fed, through its boards, from the origin` });
        return;
      }
      if (seen.includes(at)) return; // a loop further up, reported at its own boards
      seen.push(at);
      at = parent.get(at);
    }
  });
  return problems;
}

/** The boards from the origin down: each after the board that feeds it (input order kept otherwise). */
export function boardOrder<B extends TreeBoard>(boards: readonly B[]): B[] {
  const out: B[] = [];
  const placed = new Set<string>();
  let left = [...boards];
  while (left.length > 0) {
    const next = left.filter((b) => {
      const feed = b.fed_by === undefined ? null : parseFeed(b.fed_by);
      return feed === null || placed.has(feed.board) || !boards.some((x) => x.id === feed.board);
    });
    if (next.length === 0) throw new Error(`boards ${left.map((b) => b.id).join(', ')} form a loop (validation should have refused it)`);
    for (const b of next) { out.push(b); placed.add(b.id); }
    left = left.filter((b) => !placed.has(b.id));
  }
  return out;
}

/** The board each circuit feeds, by the circuit's BOARD/REF key. */
export function fedBoards(boards: readonly TreeBoard[]): Map<string, string> {
  const m = new Map<string, string>();
  for (const b of boards) {
    const feed = b.fed_by === undefined ? null : parseFeed(b.fed_by);
    if (feed) m.set(feedKey(feed), b.id);
  }
  return m;
}
