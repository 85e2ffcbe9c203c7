import { sequelize } from '../lib/platform/db';
import { RunTool } from './run-tool';
import { RunFigureHistory } from './run-figure-history';
import { Equipment } from './equipment';
import { CalibrationSession } from './calibration-session';
import { CalibrationResult } from './calibration-result';
import { CalibrationLimit } from './calibration-limit';
import { CalibrationCorrection } from './calibration-correction';
import { AuditEntry } from './audit-entry';
import { CapturedMail } from './captured-mail';
import { Cohort } from './cohort';
import { CohortCriteria } from './cohort-criteria';
import { CohortMember } from './cohort-member';
import { ColumnMap } from './column-map';
import { ComparisonCache } from './comparison-cache';
import { HardwareSet } from './hardware-set';
import { Joint } from './joint';
import { JointPosition } from './joint-position';
import { JointVersion } from './joint-version';
import { Lubricant } from './lubricant';
import { LubricantLot } from './lubricant-lot';
import { Method } from './method';
import { OneTimeToken } from './one-time-token';
import { Reading } from './reading';
import { Run } from './run';
import { SavedComparison } from './saved-comparison';
import { ReviewLink } from './review-link';
import { RunAnalysisRow } from './run-analysis';
import { RunComment } from './run-comment';
import { RunHold } from './run-hold';
import { RunCount } from './run-count';
import { RunListVersion } from './run-list-version';
import { RunVerdict } from './run-verdict';
import { SignInAttempt } from './sign-in-attempt';
import { StreamSample } from './stream-sample';
import { StreamToken } from './stream-token';
import { TighteningStep } from './tightening-step';
import { StepPosition } from './step-position';
import { Upload } from './upload';
import { UploadChunk } from './upload-chunk';
import { CourseOutcome } from './course-outcome';
import { TrainingRecord } from './training-record';
import { Job } from './job';
import { RefresherReminder } from './refresher-reminder';
import { TheoryResult } from './theory-result';
import { ChecklistItem } from './checklist-item';
import { ChecklistTick } from './checklist-tick';
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
  ReviewLink,
  UserPreference,
  CalibrationLimit,
  CalibrationSession,
  CalibrationResult,
  JointVersion,
  CalibrationCorrection,
  RunFigureHistory,
  Equipment,
  RunTool,
  RunAnalysisRow,
  CourseOutcome,
  TrainingRecord,
  RunHold,
  HardwareSet,
  LubricantLot,
  Job,
  RefresherReminder,
  TheoryResult,
  ChecklistItem,
  ChecklistTick,
  StepPosition,
  RunCount,
  RunListVersion,
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
  Run.hasMany(RunHold, { as: 'holds', foreignKey: 'runId' });
  Run.belongsTo(HardwareSet, { as: 'hardwareSet', foreignKey: 'hardwareSetId' });
  Run.belongsTo(LubricantLot, { as: 'lubricantLot', foreignKey: 'lubricantLotId' });
  Lubricant.hasMany(LubricantLot, { as: 'lots', foreignKey: 'lubricantId' });
  LubricantLot.belongsTo(Lubricant, { as: 'lubricant', foreignKey: 'lubricantId' });
  TighteningStep.hasMany(Reading, { as: 'readings', foreignKey: 'stepId' });
  TighteningStep.hasMany(StepPosition, { as: 'covers', foreignKey: 'stepId' });
  RunComment.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  OneTimeToken.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Cohort.hasOne(CohortCriteria, { as: 'criteria', foreignKey: 'cohortId' });
  Run.hasOne(RunVerdict, { as: 'verdict', foreignKey: 'runId' });
  RunVerdict.belongsTo(User, { as: 'signedBy', foreignKey: 'signedById' });
  UserSession.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Upload.hasMany(UploadChunk, { as: 'chunks', foreignKey: 'uploadId' });
  SavedComparison.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  ReviewLink.belongsTo(SavedComparison, { as: 'savedComparison', foreignKey: 'savedComparisonId' });
  CalibrationSession.hasMany(CalibrationResult, { as: 'results', foreignKey: 'sessionId' });
}

export {
  sequelize,
  TheoryResult,
  ChecklistItem,
  ChecklistTick,
  RunHold,
  HardwareSet,
  LubricantLot,
  AuditEntry,
  SavedComparison,
  ReviewLink,
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
  RunAnalysisRow,
  SignInAttempt,
  TighteningStep,
  StepPosition,
  Upload,
  UploadChunk,
  User,
  UserSession,
  UserPreference,
  CalibrationLimit,
  CalibrationSession,
  CalibrationResult,
  JointVersion,
  CalibrationCorrection,
  RunFigureHistory,
  Equipment,
  RunTool,
  CourseOutcome,
  TrainingRecord,
  Job,
  RefresherReminder,
  RunCount,
  RunListVersion,
};
