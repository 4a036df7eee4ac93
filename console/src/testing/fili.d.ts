// fili ships without types; the console's specs use it only as an independent reference.
declare module 'fili' {
  interface FiliCoefficients {
    a: number[];
    b: number[];
  }
  interface FiliCascadeOptions {
    order: number;
    characteristic: 'butterworth' | 'bessel';
    Fs: number;
    Fc: number;
    gain?: number;
    BW?: number;
    preGain?: boolean;
  }
  class CalcCascades {
    lowpass(options: FiliCascadeOptions): FiliCoefficients[];
    highpass(options: FiliCascadeOptions): FiliCoefficients[];
  }
  class IirFilter {
    constructor(coefficients: FiliCoefficients[]);
    responsePoint(options: { Fs: number; Fr: number }): {
      magnitude: number;
      dBmagnitude: number;
      phase: number;
    };
  }
  const Fili: { CalcCascades: typeof CalcCascades; IirFilter: typeof IirFilter };
  export default Fili;
}
