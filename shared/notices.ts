/** Something a calculation changed or doubts (a clamped value, a risky setting). */
export interface CalculationWarning {
  code: string;
  /** Label of the channel concerned, if any. */
  channel?: string;
  message: string;
}

/** Where acting on a result can hurt someone or damage equipment. */
export interface Caution {
  code: string;
  message: string;
}
