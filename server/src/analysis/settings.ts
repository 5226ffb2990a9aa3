/**
 * Settings the adapters pass into the analysis. Every field is optional; the core applies its own
 * defaults (each with its origin) where a field is absent.
 */
export interface AnalysisSettings {
  derating?: {
    reverseVoltage?: number;
    forwardCurrent?: number;
    surgeCurrent?: number;
    junctionTempC?: number;
    capacitorVoltage?: number;
  };
  corners?: {
    lineLow?: number;
    lineHigh?: number;
    ambientNominalC?: number;
    ambientMaxC?: number;
  };
  /** How much the inlay hints say. */
  hintDetail?: 'off' | 'brief' | 'full';
}

export const DEFAULT_SETTINGS: AnalysisSettings = { hintDetail: 'brief' };
