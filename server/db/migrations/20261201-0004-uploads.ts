import { DataTypes, type QueryInterface } from 'sequelize';

/** Uploaded files (ball photos): metadata here, bytes behind the storage interface under a generated name. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'uploads',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        owner_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        storage_key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
        content_type: { type: DataTypes.STRING(40), allowNull: false },
        size_bytes: { type: DataTypes.INTEGER, allowNull: false },
        original_name: { type: DataTypes.STRING(200), allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.addColumn(
      'balls',
      'photo_upload_id',
      { type: DataTypes.INTEGER, allowNull: true, references: { model: 'uploads', key: 'id' }, onDelete: 'SET NULL' },
      { transaction },
    );
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('balls', 'photo_upload_id');
  await qi.dropTable('uploads');
}
