import { createContext, useContext, type ReactNode } from 'react';
import {
  defaultCompute,
  type ComputeFunction,
} from '@/features/worksheets/compute/compute-function.ts';

const ComputeContext = createContext<ComputeFunction | null>(null);

/** Replaces how results are computed below it (tests inject a direct call or a fake). */
export function WorksheetComputeProvider({
  compute,
  children,
}: {
  compute: ComputeFunction;
  children: ReactNode;
}) {
  return <ComputeContext.Provider value={compute}>{children}</ComputeContext.Provider>;
}

export function useComputeFunction(): ComputeFunction {
  return useContext(ComputeContext) ?? defaultCompute();
}
