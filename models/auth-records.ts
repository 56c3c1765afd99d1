/** next-auth's own tables (used by the e-mail sign-in link), with the adapter's column set. */
import { models as authModels } from "@next-auth/sequelize-adapter";
import { Model, type Sequelize } from "sequelize";

export class Account extends Model {}
export class AuthSession extends Model {}
export class VerificationToken extends Model {}

export function initAuthRecords(sequelize: Sequelize) {
  const options = { sequelize, underscored: true, timestamps: false } as const;
  const A = class extends Account {};
  A.init(authModels.Account, { ...options, modelName: "account", tableName: "accounts" });
  const S = class extends AuthSession {};
  S.init(authModels.Session, { ...options, modelName: "session", tableName: "sessions" });
  const V = class extends VerificationToken {};
  V.init(authModels.VerificationToken, {
    ...options,
    modelName: "verificationToken",
    tableName: "verification_tokens",
  });
  return { Account: A, AuthSession: S, VerificationToken: V };
}
