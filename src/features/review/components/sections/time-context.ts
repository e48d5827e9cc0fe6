/** What every time chart of a review shares: the cursor, the zoom group and the hover stretches. */
export interface TimeContext {
  cursorT: number | null;
  onCursor: (tS: number) => void;
  group: string;
  hover: [number, number][];
}
