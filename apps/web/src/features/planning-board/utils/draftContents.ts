import type { AssignmentGridDto } from '@rotaplex/contracts';

/** What a new Generate would replace in a draft, and what it keeps. */
export interface DraftContents {
  /** Shifts in cells that are not pinned: Generate replaces them, edits made by hand included. */
  replaced: number;
  /** Pinned cells (a shift or a day off): Generate keeps them as they are. */
  pinned: number;
}

/**
 * Counts the draft's unpinned shifts and its pins. The board does not know which shifts were
 * edited by hand, so any unpinned shift is treated as work a Generate would throw away.
 */
export function draftContents(grid: AssignmentGridDto | undefined): DraftContents {
  let replaced = 0;
  let pinned = 0;
  for (const row of grid?.rows ?? []) {
    for (const cell of row.cells) {
      if (cell.pinned) pinned += 1;
      else if (cell.shiftTypeId !== null) replaced += 1;
    }
  }
  return { replaced, pinned };
}

/** The confirmation's words: what Generate replaces and that pins are kept. */
export function replaceWarning({ replaced, pinned }: DraftContents): string {
  const shifts = `${replaced} ${replaced === 1 ? 'shift' : 'shifts'}`;
  const kept =
    pinned === 0
      ? 'Pin a cell first to keep it: pinned cells are never changed by Generate.'
      : `The ${pinned} pinned ${pinned === 1 ? 'cell stays' : 'cells stay'} as ${pinned === 1 ? 'it is' : 'they are'}.`;
  return `Generate replaces the ${shifts} of this draft that are not pinned, including changes made by hand. ${kept}`;
}
