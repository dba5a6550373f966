import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { ModelKind } from '@biasproof/calc';
import type { ModelRatings } from '@biasproof/shared';

export interface ModelLibraryEntryAttributes {
  id: string;
  orgId: string;
  /** Unique in the organization regardless of case. */
  name: string;
  kind: ModelKind;
  /** SPICE model-card parameters by upper-case name. */
  params: Record<string, number>;
  ratings: ModelRatings;
  notes: string;
  createdByUserId: string;
  createdAt: Date;
  updatedAt: Date;
}
type Creation = Optional<
  ModelLibraryEntryAttributes,
  'id' | 'params' | 'ratings' | 'notes' | 'createdAt' | 'updatedAt'
>;
export type ModelLibraryEntryRow = Model<ModelLibraryEntryAttributes, Creation> &
  ModelLibraryEntryAttributes;

export function defineModelLibraryEntry(sequelize: Sequelize): ModelStatic<ModelLibraryEntryRow> {
  return sequelize.define<ModelLibraryEntryRow>(
    'ModelLibraryEntry',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      orgId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      kind: { type: DataTypes.TEXT, allowNull: false },
      params: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      ratings: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdByUserId: { type: DataTypes.UUID, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'model_library_entries' },
  );
}
