// The public face of the trade rules: import from here, nowhere else in shared/trade.

export { NOMINAL_SIZES, nominalSizeLabel, parseNominalSize, unknownSizeReason, type NominalSize } from './nominal-size';
export { refuse, SUPERVISOR_MAY_ENTER, type PipeSchedule, type Refusal } from './result';
export {
  MAX_SERVICE_TEMPERATURE_F, MAX_SERVICE_TEMPERATURE_SOURCE, maxServiceTemperatureF, parsePipeMaterial, PIPE_MATERIALS, TABLED_MATERIALS,
  type Material, type TabledMaterial,
} from './pipe-materials';
export { SOURCES } from './sources';
export { IPS_PIPE_TABLE, pipeRow, type PipeRow } from './pipe-dimensions';
export { DERATING_TABLE, deratingFactor, type DeratingMaker, type DeratingRow } from './derating';
export { HDS_PSI, isoRating, pipeRating, sdrRating, type PipeRating, type PipeRatingInput } from './pipe-rating';
export { CURE_SCHEDULES, DEFAULT_CURE_SCHEDULE_ID, TEMPERATURE_BANDS, type CureScheduleTable } from './cure-tables';
export { cureSchedule, findCureSchedule, listCureSchedules, type CureScheduleInput, type CureScheduleResult } from './cure-schedule';
export { cureCompleteAt, type CureInterval, type CureLogInput, type CureLogResult, type CureReading } from './cure-log';
export { checkTestMedium, MIN_TEST_HOLD_MINUTES, TEST_CAPS, testPressure, type TestCap, type TestPressureInput, type TestPressureResult } from './test-pressure';
export { chamferGuidance, CHECK_MARK_OFFSET_IN, dryFitCheck, SOCKET_DEPTH_IN, socketMarks, type DryFit } from './socket';
export { CEMENT_FOR_MATERIAL, cementBody, cementCheck, normaliseStandard, primerCheck, type CementBody, type CementCheckInput } from './cement';
export { cementQuantities, containersFor, JOINTS_PER_QUART, jointsPerQuart, type CementQuantities, type Container } from './materials';
export { applicatorSize, assemblyHoldSeconds, crewAndTools, type ApplicatorKind } from './joint-handling';
export { cementShelfLife, SHELF_LIFE_YEARS } from './shelf-life';
export {
  barToPsi, cToF, fToC, inToMm, kpaToPsi, mmToIn, parseLength, parsePressure, parseTemperature, psiToBar, psiToKpa,
} from './units';
export { CAUTION_STEPS, CAUTIONS, cautionsFor, DEFERENCE, type Caution, type CautionStep } from './cautions';
export { needsChemicalCaution } from './cautions';
export { jointSpecSchema, type JointSpec, type JointSpecInput } from './joint-spec';
export { jointPicture, type JointPicture } from './joint-picture';
