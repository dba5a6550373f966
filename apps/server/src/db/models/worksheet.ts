import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { WorksheetState } from '@biasproof/shared';

export interface WorksheetAttributes {
  id: string;
  orgId: string;
  projectId: string;
  title: string;
  /** What the analog block is and does. */
  description: string;
  authorUserId: string;
  checkerUserId: string | null;
  approverUserId: string | null;
  /** Who accepted the current revision (set on accept, cleared on submit). */
  checkedByUserId: string | null;
  state: WorksheetState;
  /** Letter of the current revision (A, B, C…). */
  currentRevision: string;
  /** Optimistic-locking counter, +1 on every saved change. */
  version: number;
  createdAt: Date;
  updatedAt: Date;
}
type Creation = Optional<
  WorksheetAttributes,
  | 'id'
  | 'description'
  | 'checkerUserId'
  | 'approverUserId'
  | 'checkedByUserId'
  | 'state'
  | 'currentRevision'
  | 'version'
  | 'createdAt'
  | 'updatedAt'
>;
export type WorksheetRow = Model<WorksheetAttributes, Creation> & WorksheetAttributes;

export function defineWorksheet(sequelize: Sequelize): ModelStatic<WorksheetRow> {
  return sequelize.define<WorksheetRow>(
    'Worksheet',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      orgId: { type: DataTypes.UUID, allowNull: false },
      projectId: { type: DataTypes.UUID, allowNull: false },
      title: { type: DataTypes.TEXT, allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      authorUserId: { type: DataTypes.UUID, allowNull: false },
      checkerUserId: { type: DataTypes.UUID, allowNull: true },
      approverUserId: { type: DataTypes.UUID, allowNull: true },
      checkedByUserId: { type: DataTypes.UUID, allowNull: true },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
      currentRevision: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'A' },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'worksheets' },
  );
}
