// Models of the conversations with the client: briefs, mood boards and their decisions, reviews, comments, follows.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Questionnaire } from '@/lib/briefs/questionnaire';

export type BriefAnswers = Record<string, string | string[]>;

export class Brief extends Model<InferAttributes<Brief>, InferCreationAttributes<Brief>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare template: string;
  declare title: string;
  /** The questions as sent, so later template edits never change what the client saw. */
  declare questions: Questionnaire;
  declare contactName: string;
  declare contactEmail: string;
  declare tokenHash: string;
  declare answers: CreationOptional<BriefAnswers>;
  declare sentById: string | null;
  declare expiresAt: Date;
  declare answeredAt: Date | null;
  declare submittedAt: Date | null;
  declare revokedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export type BoardStatus = 'draft' | 'sent' | 'approved' | 'changes_requested';
export type BoardItemKind = 'image' | 'swatch' | 'type' | 'note';
export type Verdict = 'keep' | 'drop';

export class MoodBoard extends Model<InferAttributes<MoodBoard>, InferCreationAttributes<MoodBoard>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare title: string;
  declare intro: CreationOptional<string>;
  declare status: CreationOptional<BoardStatus>;
  declare contactName: string | null;
  declare contactEmail: string | null;
  declare tokenHash: string | null;
  declare expiresAt: Date | null;
  declare sentAt: Date | null;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class MoodBoardItem extends Model<InferAttributes<MoodBoardItem>, InferCreationAttributes<MoodBoardItem>> {
  declare id: CreationOptional<string>;
  declare boardId: string;
  declare kind: BoardItemKind;
  declare position: number;
  declare caption: CreationOptional<string>;
  declare storageKey: string | null;
  declare contentType: string | null;
  declare width: number | null;
  declare height: number | null;
  declare colorName: string | null;
  declare colorValue: string | null;
  declare colorHex: string | null;
  declare fontFamily: string | null;
  declare sampleText: string | null;
  declare verdict: Verdict | null;
  declare verdictComment: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class MoodBoardDecision extends Model<InferAttributes<MoodBoardDecision>, InferCreationAttributes<MoodBoardDecision>> {
  declare id: CreationOptional<string>;
  declare boardId: string;
  declare outcome: 'approved' | 'changes_requested';
  declare comment: string;
  declare decidedByName: string;
  declare decidedByEmail: string | null;
  declare verdicts: { itemId: string; verdict: Verdict; comment: string }[];
  declare createdAt: CreationOptional<Date>;
}

export type ReviewStatus = 'open' | 'approved' | 'changes_requested';

export class ReviewRequest extends Model<InferAttributes<ReviewRequest>, InferCreationAttributes<ReviewRequest>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare revision: number;
  declare message: CreationOptional<string>;
  declare requestedById: string | null;
  declare status: CreationOptional<ReviewStatus>;
  declare decidedById: string | null;
  declare decidedAt: Date | null;
  declare decisionNote: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class ReviewComment extends Model<InferAttributes<ReviewComment>, InferCreationAttributes<ReviewComment>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare reviewId: string | null;
  declare parentId: string | null;
  declare blockId: string;
  declare revision: number;
  declare body: string;
  declare authorId: string | null;
  declare resolvedAt: Date | null;
  declare resolvedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class BrandFollow extends Model<InferAttributes<BrandFollow>, InferCreationAttributes<BrandFollow>> {
  declare id: CreationOptional<string>;
  declare brandId: string;
  declare userId: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

const id = { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true };
const timestamps = { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE };
const text = (n: number, allowNull = true) => ({ type: DataTypes.STRING(n), allowNull });

/** Bind the collaboration models; called from initModels. */
export function initCollaborationModels(sequelize: Sequelize): void {
  const common = { sequelize, underscored: true };
  Brief.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      template: text(60, false),
      title: text(200, false),
      questions: { type: DataTypes.JSONB, allowNull: false },
      contactName: text(120, false),
      contactEmail: text(320, false),
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      answers: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      sentById: { type: DataTypes.TEXT, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      answeredAt: { type: DataTypes.DATE, allowNull: true },
      submittedAt: { type: DataTypes.DATE, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    },
    { ...common, tableName: 'briefs' },
  );
  MoodBoard.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      title: text(160, false),
      intro: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: '' },
      status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'draft' },
      contactName: text(120),
      contactEmail: text(320),
      tokenHash: { type: DataTypes.STRING(64), allowNull: true, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: true },
      sentAt: { type: DataTypes.DATE, allowNull: true },
      createdById: { type: DataTypes.TEXT, allowNull: true },
      ...timestamps,
    },
    { ...common, tableName: 'mood_boards' },
  );
  MoodBoardItem.init(
    {
      id,
      boardId: { type: DataTypes.UUID, allowNull: false },
      kind: text(10, false),
      position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      caption: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      storageKey: text(200),
      contentType: text(40),
      width: { type: DataTypes.INTEGER, allowNull: true },
      height: { type: DataTypes.INTEGER, allowNull: true },
      colorName: text(80),
      colorValue: text(200),
      colorHex: text(9),
      fontFamily: text(120),
      sampleText: text(300),
      verdict: text(10),
      verdictComment: text(1000),
      ...timestamps,
    },
    { ...common, tableName: 'mood_board_items' },
  );
  MoodBoardDecision.init(
    {
      id,
      boardId: { type: DataTypes.UUID, allowNull: false },
      outcome: text(20, false),
      comment: { type: DataTypes.STRING(4000), allowNull: false, defaultValue: '' },
      decidedByName: text(120, false),
      decidedByEmail: text(320),
      verdicts: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      createdAt: DataTypes.DATE,
    },
    { ...common, tableName: 'mood_board_decisions', updatedAt: false },
  );
  ReviewRequest.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      message: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: '' },
      requestedById: { type: DataTypes.TEXT, allowNull: true },
      status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'open' },
      decidedById: { type: DataTypes.TEXT, allowNull: true },
      decidedAt: { type: DataTypes.DATE, allowNull: true },
      decisionNote: text(4000),
      ...timestamps,
    },
    { ...common, tableName: 'review_requests' },
  );
  ReviewComment.init(
    {
      id,
      brandId: { type: DataTypes.UUID, allowNull: false },
      reviewId: { type: DataTypes.UUID, allowNull: true },
      parentId: { type: DataTypes.UUID, allowNull: true },
      blockId: text(100, false),
      revision: { type: DataTypes.INTEGER, allowNull: false },
      body: text(4000, false),
      authorId: { type: DataTypes.TEXT, allowNull: true },
      resolvedAt: { type: DataTypes.DATE, allowNull: true },
      resolvedById: { type: DataTypes.TEXT, allowNull: true },
      ...timestamps,
    },
    { ...common, tableName: 'review_comments' },
  );
  BrandFollow.init(
    { id, brandId: { type: DataTypes.UUID, allowNull: false }, userId: { type: DataTypes.TEXT, allowNull: false }, ...timestamps },
    { ...common, tableName: 'brand_follows' },
  );
  MoodBoard.hasMany(MoodBoardItem, { foreignKey: 'boardId', as: 'items' });
  MoodBoardItem.belongsTo(MoodBoard, { foreignKey: 'boardId', as: 'board' });
}
