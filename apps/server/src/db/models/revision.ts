import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { EncodedResults } from '@biasproof/shared';

export interface RevisionAttributes {
  id: string;
  orgId: string;
  worksheetId: string;
  /** A, B, C… */
  letter: string;
  /** The engine's circuit (circuitSchema output). */
  circuit: unknown;
  /** The analysis settings (analysisSettingsSchema output). */
  settings: unknown;
  /** WorksheetResults with non-finite numbers as strings (canonical-json.ts). */
  results: EncodedResults;
  /** `results.status`, kept in its own column for lists. */
  resultStatus: 'solved' | 'failed' | 'empty';
  engineVersion: string;
  /** SHA-256 (hex) of the canonical JSON of {circuit, settings, results}. */
  contentHash: string;
  /** Set at submission; the database refuses any later change to the row. */
  frozen: boolean;
  createdByUserId: string;
  createdAt: Date;
  updatedAt: Date;
}
type Creation = Optional<RevisionAttributes, 'id' | 'frozen' | 'createdAt' | 'updatedAt'>;
export type RevisionRow = Model<RevisionAttributes, Creation> & RevisionAttributes;

export function defineRevision(sequelize: Sequelize): ModelStatic<RevisionRow> {
  return sequelize.define<RevisionRow>(
    'Revision',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      orgId: { type: DataTypes.UUID, allowNull: false },
      worksheetId: { type: DataTypes.UUID, allowNull: false },
      letter: { type: DataTypes.TEXT, allowNull: false },
      circuit: { type: DataTypes.JSONB, allowNull: false },
      settings: { type: DataTypes.JSONB, allowNull: false },
      results: { type: DataTypes.JSONB, allowNull: false },
      resultStatus: { type: DataTypes.TEXT, allowNull: false },
      engineVersion: { type: DataTypes.TEXT, allowNull: false },
      contentHash: { type: DataTypes.TEXT, allowNull: false },
      frozen: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      createdByUserId: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'revisions' },
  );
}
