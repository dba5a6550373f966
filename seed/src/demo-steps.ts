import type { Sequelize } from 'sequelize';

export interface DemoStepResult {
  /** True when this run wrote the step's data (false when it was already there). */
  loaded: boolean;
  /** Lines describing demo sign-ins to print, e.g. `ada@… (author) — password …`. */
  signIns: string[];
}

export interface DemoStep {
  name: string;
  load(sequelize: Sequelize): Promise<DemoStepResult>;
}

/**
 * The demo scenario, in load order. Organizations, people and worksheets are added by the
 * features that own those tables; until accounts exist there is nothing to load.
 */
export const demoSteps: DemoStep[] = [];
