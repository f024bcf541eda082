import { DataTypes, type ModelAttributes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

/** Users, reference pages and their revisions, results with their trail, comparison cells, sessions. */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    handle: { type: DataTypes.STRING(40), allowNull: false, unique: true },
    displayName: { type: DataTypes.STRING(80), allowNull: false },
    email: { type: DataTypes.STRING(200), allowNull: true },
    role: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'member' },
    banned: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    oauthSubject: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    bio: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });

  for (const table of ['steels', 'abrasives', 'methods']) {
    const specific: ModelAttributes =
      table === 'steels'
        ? {
            category: { type: DataTypes.STRING(30), allowNull: false },
            designations: { type: DataTypes.JSON, allowNull: false },
            composition: { type: DataTypes.JSON, allowNull: false },
            hardnessMinHrc: { type: DataTypes.FLOAT, allowNull: true },
            hardnessMaxHrc: { type: DataTypes.FLOAT, allowNull: true },
          }
        : table === 'abrasives'
          ? {
              material: { type: DataTypes.STRING(30), allowNull: false },
              bond: { type: DataTypes.STRING(30), allowNull: false },
              form: { type: DataTypes.STRING(30), allowNull: false },
              gritStandard: { type: DataTypes.STRING(20), allowNull: false },
              gritGrade: { type: DataTypes.STRING(40), allowNull: false },
              gritUm: { type: DataTypes.FLOAT, allowNull: false },
              gritRange: { type: DataTypes.JSON, allowNull: true },
              wheelDiameterMm: { type: DataTypes.FLOAT, allowNull: true },
              widthMm: { type: DataTypes.FLOAT, allowNull: true },
              wears: { type: DataTypes.BOOLEAN, allowNull: false },
              coolant: { type: DataTypes.STRING(30), allowNull: false },
              sideUsable: { type: DataTypes.BOOLEAN, allowNull: false },
            }
          : {
              version: { type: DataTypes.INTEGER, allowNull: false },
              replacesId: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'methods', key: 'id' } },
              instrument: { type: DataTypes.STRING(200), allowNull: false },
              medium: { type: DataTypes.STRING(200), allowNull: false },
              readingsPerEdge: { type: DataTypes.INTEGER, allowNull: false },
              retentionMedium: { type: DataTypes.STRING(200), allowNull: true },
              thresholdG: { type: DataTypes.FLOAT, allowNull: true },
            };
    await qi.createTable(table, {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(200), allowNull: false },
      ...specific,
      body: { type: DataTypes.JSON, allowNull: true },
      citations: { type: DataTypes.JSON, allowNull: false, defaultValue: '[]' },
      currentRevisionId: { type: DataTypes.INTEGER, allowNull: true },
      ...timestamps,
    });
  }

  await qi.createTable('page_revisions', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    pageType: { type: DataTypes.STRING(20), allowNull: false },
    pageId: { type: DataTypes.INTEGER, allowNull: false },
    authorId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    summary: { type: DataTypes.STRING(300), allowNull: false },
    fields: { type: DataTypes.JSON, allowNull: false },
    body: { type: DataTypes.JSON, allowNull: true },
    status: { type: DataTypes.STRING(20), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('page_revisions', ['pageType', 'pageId']);

  await qi.createTable('results', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    authorId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    status: { type: DataTypes.STRING(20), allowNull: false },
    steelId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'steels', key: 'id' } },
    abrasiveId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'abrasives', key: 'id' } },
    sharpnessMethodId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'methods', key: 'id' } },
    retentionMethodId: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'methods', key: 'id' } },
    input: { type: DataTypes.JSON, allowNull: false },
    material: { type: DataTypes.STRING(30), allowNull: false },
    hrc: { type: DataTypes.FLOAT, allowNull: false },
    gritStandard: { type: DataTypes.STRING(20), allowNull: false },
    gritGrade: { type: DataTypes.STRING(40), allowNull: false },
    gritUm: { type: DataTypes.FLOAT, allowNull: false },
    gritPhi: { type: DataTypes.INTEGER, allowNull: false },
    perSideDeg: { type: DataTypes.FLOAT, allowNull: false },
    inclusiveDeg: { type: DataTypes.FLOAT, allowNull: false },
    sharpnessMedianG: { type: DataTypes.FLOAT, allowNull: false },
    retentionCuts: { type: DataTypes.INTEGER, allowNull: true },
    notesHtml: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    approvedAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('results', ['status', 'createdAt']);
  await qi.addIndex('results', ['authorId', 'createdAt']);
  await qi.addIndex('results', ['sharpnessMethodId', 'steelId', 'material', 'gritPhi', 'status']);

  await qi.createTable('result_events', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    resultId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'results', key: 'id' } },
    actorId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    fromStatus: { type: DataTypes.STRING(20), allowNull: true },
    toStatus: { type: DataTypes.STRING(20), allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('result_events', ['resultId']);

  await qi.createTable('comparison_cells', {
    methodId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    steelId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    material: { type: DataTypes.STRING(30), allowNull: false, primaryKey: true },
    gritPhi: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    n: { type: DataTypes.INTEGER, allowNull: false },
    testers: { type: DataTypes.INTEGER, allowNull: false },
    medianG: { type: DataTypes.FLOAT, allowNull: false },
    q1G: { type: DataTypes.FLOAT, allowNull: false },
    q3G: { type: DataTypes.FLOAT, allowNull: false },
    meanG: { type: DataTypes.FLOAT, allowNull: false },
    sdG: { type: DataTypes.FLOAT, allowNull: true },
    ciLoG: { type: DataTypes.FLOAT, allowNull: true },
    ciHiG: { type: DataTypes.FLOAT, allowNull: true },
    retentionMedianCuts: { type: DataTypes.FLOAT, allowNull: true },
    hrcMin: { type: DataTypes.FLOAT, allowNull: false },
    hrcMax: { type: DataTypes.FLOAT, allowNull: false },
    angleMinDeg: { type: DataTypes.FLOAT, allowNull: false },
    angleMaxDeg: { type: DataTypes.FLOAT, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });

  // connect-session-sequelize's table, created here rather than by its sync().
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(36), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const t of ['sessions', 'comparison_cells', 'result_events', 'results', 'page_revisions', 'methods', 'abrasives', 'steels', 'users']) {
    await qi.dropTable(t);
  }
}
