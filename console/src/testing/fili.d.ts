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
  interface FiliCascadeCalculator {
    lowpass(options: FiliCascadeOptions): FiliCoefficients[];
    highpass(options: FiliCascadeOptions): FiliCoefficients[];
  }
  interface FiliIirFilter {
    responsePoint(options: { Fs: number; Fr: number }): {
      magnitude: number;
      dBmagnitude: number;
      phase: number;
    };
  }
  const Fili: {
    CalcCascades: new () => FiliCascadeCalculator;
    IirFilter: new (coefficients: FiliCoefficients[]) => FiliIirFilter;
  };
  export default Fili;
}
