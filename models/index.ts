import { sequelize } from '../lib/platform/db';
import { AuditEntry } from './audit-entry';
import { CapturedMail } from './captured-mail';
import { Cohort } from './cohort';
import { CohortCriteria } from './cohort-criteria';
import { CohortMember } from './cohort-member';
import { ColumnMap } from './column-map';
import { ComparisonCache } from './comparison-cache';
import { Joint } from './joint';
import { JointPosition } from './joint-position';
import { Lubricant } from './lubricant';
import { Method } from './method';
import { OneTimeToken } from './one-time-token';
import { Reading } from './reading';
import { Run } from './run';
import { SavedComparison } from './saved-comparison';
import { RunComment } from './run-comment';
import { RunVerdict } from './run-verdict';
import { SignInAttempt } from './sign-in-attempt';
import { StreamSample } from './stream-sample';
import { StreamToken } from './stream-token';
import { TighteningStep } from './tightening-step';
import { Upload } from './upload';
import { UploadChunk } from './upload-chunk';
import { CourseOutcome } from './course-outcome';
import { TrainingRecord } from './training-record';
import { User } from './user';
import { UserPreference } from './user-preference';
import { UserSession } from './user-session';

/** Every model: one per table the migrations create (`tests/integration/models-match-schema.test.ts` checks it). */
export const MODELS = [
  User,
  Cohort,
  CohortMember,
  Joint,
  JointPosition,
  Method,
  Lubricant,
  Run,
  TighteningStep,
  Reading,
  Upload,
  UploadChunk,
  RunComment,
  SignInAttempt,
  OneTimeToken,
  CohortCriteria,
  RunVerdict,
  CapturedMail,
  UserSession,
  ComparisonCache,
  ColumnMap,
  StreamToken,
  StreamSample,
  AuditEntry,
  SavedComparison,
  UserPreference,
  CourseOutcome,
  TrainingRecord,
] as const;

// Module code runs once per module instance: init and wire the models here.
{
  for (const model of MODELS) model.initModel(sequelize);

  Cohort.belongsTo(User, { as: 'instructor', foreignKey: 'instructorId' });
  Cohort.belongsToMany(User, { through: CohortMember, as: 'members', foreignKey: 'cohortId', otherKey: 'userId' });
  User.belongsToMany(Cohort, { through: CohortMember, as: 'cohorts', foreignKey: 'userId', otherKey: 'cohortId' });
  Joint.hasMany(JointPosition, { as: 'positions', foreignKey: 'jointId' });
  Run.belongsTo(Joint, { as: 'joint', foreignKey: 'jointId' });
  Run.belongsTo(Method, { as: 'method', foreignKey: 'methodId' });
  Run.belongsTo(Lubricant, { as: 'lubricant', foreignKey: 'lubricantId' });
  Run.belongsTo(User, { as: 'operator', foreignKey: 'operatorId' });
  Run.belongsTo(Cohort, { as: 'cohort', foreignKey: 'cohortId' });
  Run.hasMany(TighteningStep, { as: 'steps', foreignKey: 'runId' });
  Run.hasMany(RunComment, { as: 'comments', foreignKey: 'runId' });
  TighteningStep.hasMany(Reading, { as: 'readings', foreignKey: 'stepId' });
  RunComment.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  OneTimeToken.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Cohort.hasOne(CohortCriteria, { as: 'criteria', foreignKey: 'cohortId' });
  Run.hasOne(RunVerdict, { as: 'verdict', foreignKey: 'runId' });
  RunVerdict.belongsTo(User, { as: 'signedBy', foreignKey: 'signedById' });
  UserSession.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Upload.hasMany(UploadChunk, { as: 'chunks', foreignKey: 'uploadId' });
  SavedComparison.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
}

export {
  sequelize,
  AuditEntry,
  SavedComparison,
  CapturedMail,
  Cohort,
  CohortCriteria,
  ColumnMap,
  ComparisonCache,
  StreamSample,
  StreamToken,
  OneTimeToken,
  RunVerdict,
  CohortMember,
  Joint,
  JointPosition,
  Lubricant,
  Method,
  Reading,
  Run,
  RunComment,
  SignInAttempt,
  TighteningStep,
  Upload,
  UploadChunk,
  User,
  UserSession,
  UserPreference,
  CourseOutcome,
  TrainingRecord,
};
