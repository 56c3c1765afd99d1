/**
 * All models of one Sequelize instance, initialised together with their associations.
 * Always reach models through the object this returns (never by importing a class and using it
 * directly): Next may evaluate a module twice, and only these classes are bound to the instance.
 */
import type { Sequelize } from "sequelize";
import { initAccountEvent } from "./account-event";
import { initAccountLink } from "./account-link";
import { initApiToken } from "./api-token";
import { initAuditEvent } from "./audit-event";
import { initBatch, initBatchRejection } from "./batch";
import { initAuthRecords } from "./auth-records";
import { initComment } from "./comment";
import { initFit } from "./fit";
import { initCommentThread } from "./comment-thread";
import { initInvitation } from "./invitation";
import { initJob } from "./job";
import { initKineticsVersion } from "./kinetics-version";
import { initLabKinetics } from "./lab-kinetics";
import { initReadout } from "./readout";
import { initSignupRequest } from "./signup-request";
import { initSimulationRun } from "./simulation-run";
import { initWorker } from "./worker";
import { initLab } from "./lab";
import { initMembership } from "./membership";
import { initSpecimen } from "./specimen";
import { initStudy } from "./study";
import { initUpload } from "./upload";
import { initUser } from "./user";

export function createModels(sequelize: Sequelize) {
  const models = {
    User: initUser(sequelize),
    ...initAuthRecords(sequelize),
    Lab: initLab(sequelize),
    Membership: initMembership(sequelize),
    Invitation: initInvitation(sequelize),
    AuditEvent: initAuditEvent(sequelize),
    Study: initStudy(sequelize),
    Specimen: initSpecimen(sequelize),
    Upload: initUpload(sequelize),
    ApiToken: initApiToken(sequelize),
    LabKinetics: initLabKinetics(sequelize),
    KineticsVersion: initKineticsVersion(sequelize),
    Job: initJob(sequelize),
    Readout: initReadout(sequelize),
    CommentThread: initCommentThread(sequelize),
    Comment: initComment(sequelize),
    Fit: initFit(sequelize),
    SimulationRun: initSimulationRun(sequelize),
    SignupRequest: initSignupRequest(sequelize),
    AccountEvent: initAccountEvent(sequelize),
    AccountLink: initAccountLink(sequelize),
    Worker: initWorker(sequelize),
    Batch: initBatch(sequelize),
    BatchRejection: initBatchRejection(sequelize),
  };
  const {
    User,
    Lab,
    Membership,
    Invitation,
    Study,
    Specimen,
    Upload,
    ApiToken,
    LabKinetics,
    KineticsVersion,
    Readout,
  } = models;
  Membership.belongsTo(User, { as: "user", foreignKey: "userId" });
  Membership.belongsTo(Lab, { as: "lab", foreignKey: "labId" });
  Lab.hasMany(Membership, { as: "memberships", foreignKey: "labId" });
  User.hasMany(Membership, { as: "memberships", foreignKey: "userId" });
  Invitation.belongsTo(Lab, { as: "lab", foreignKey: "labId" });
  Study.hasMany(Specimen, { as: "specimens", foreignKey: "studyId" });
  Specimen.belongsTo(Study, { as: "study", foreignKey: "studyId" });
  Specimen.hasMany(Upload, { as: "uploads", foreignKey: "specimenId" });
  Upload.belongsTo(Specimen, { as: "specimen", foreignKey: "specimenId" });
  Upload.belongsTo(User, { as: "uploader", foreignKey: "createdBy" });
  Study.belongsTo(User, { as: "creator", foreignKey: "createdBy" });
  Specimen.belongsTo(User, { as: "creator", foreignKey: "createdBy" });
  ApiToken.belongsTo(User, { as: "user", foreignKey: "userId" });
  LabKinetics.hasMany(KineticsVersion, { as: "versions", foreignKey: "kineticsId" });
  KineticsVersion.belongsTo(LabKinetics, { as: "kinetics", foreignKey: "kineticsId" });
  Upload.hasMany(Readout, { as: "readouts", foreignKey: "uploadId" });
  Readout.belongsTo(Upload, { as: "upload", foreignKey: "uploadId" });
  models.CommentThread.hasMany(models.Comment, { as: "comments", foreignKey: "threadId" });
  models.Comment.belongsTo(models.CommentThread, { as: "thread", foreignKey: "threadId" });
  return models;
}

export type Models = ReturnType<typeof createModels>;
