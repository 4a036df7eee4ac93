import type { Sequelize } from 'sequelize';
import { initApiKey } from './api-key';
import { initAuditEvent } from './audit-event';
import { initInvitation } from './invitation';
import { initMeasurement } from './measurement';
import { initMicrophone } from './microphone';
import { initProcessorProfile } from './processor-profile';
import { initRoom } from './room';
import { initRoomState } from './room-state';
import { initSession } from './session';
import { initTargetCurve } from './target-curve';
import { initTuning } from './tuning';
import { initTuningVersion } from './tuning-version';
import { initUsageBucket } from './usage-bucket';
import { initUser } from './user';

/** Every model, initialised on one connection. Each resource adds its own line here. */
export function defineModels(sequelize: Sequelize) {
  const models = {
    User: initUser(sequelize),
    ApiKey: initApiKey(sequelize),
    UsageBucket: initUsageBucket(sequelize),
    AuditEvent: initAuditEvent(sequelize),
    Invitation: initInvitation(sequelize),
    Session: initSession(sequelize),
    Room: initRoom(sequelize),
    Tuning: initTuning(sequelize),
    TuningVersion: initTuningVersion(sequelize),
    Measurement: initMeasurement(sequelize),
    ProcessorProfile: initProcessorProfile(sequelize),
    RoomState: initRoomState(sequelize),
    TargetCurve: initTargetCurve(sequelize),
    Microphone: initMicrophone(sequelize),
  };
  return models;
}

export type Models = ReturnType<typeof defineModels>;
