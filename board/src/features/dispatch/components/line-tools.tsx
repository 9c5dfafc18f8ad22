import { createContext, useContext, type ReactNode } from 'react';
import type { DispatchLine } from '@baytime/shared';

/** What the page adds under a line card (parts details for a line held for parts). */
export type LineTools = (line: DispatchLine) => ReactNode;

export const LineToolsContext = createContext<LineTools | null>(null);

export function useLineTools(): LineTools | null {
  return useContext(LineToolsContext);
}
