import { Foundation1796218693528 } from './1796218693528-Foundation.js';
import { DesignerWorkflow1796222400000 } from './1796222400000-DesignerWorkflow.js';
import { Calibration1796229600000 } from './1796229600000-Calibration.js';
import { MarginReview1796233200000 } from './1796233200000-MarginReview.js';
import { SaveVersions1796240000000 } from './1796240000000-SaveVersions.js';
import { CalibrationRecords1796250000000 } from './1796250000000-CalibrationRecords.js';
import { PasswordResets1796260000000 } from './1796260000000-PasswordResets.js';
import { OwnSeries1796271300000 } from './1796271300000-OwnSeries.js';
import { ReferenceTraceability1796274000000 } from './1796274000000-ReferenceTraceability.js';
import { BoardBuildState1796274100000 } from './1796274100000-BoardBuildState.js';

/** Listed explicitly, oldest first: glob loading fails under vitest and with URL-encoded paths. */
export const migrations = [Foundation1796218693528, DesignerWorkflow1796222400000, Calibration1796229600000, MarginReview1796233200000, SaveVersions1796240000000, CalibrationRecords1796250000000, PasswordResets1796260000000, OwnSeries1796271300000, ReferenceTraceability1796274000000, BoardBuildState1796274100000];
