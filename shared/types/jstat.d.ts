// Type declarations for the parts of jstat 1.9.6 Rindwise uses (jstat ships no types).
// Only what shared/trade/stats.ts calls is declared; extend it when more is needed.

declare module 'jstat' {
  /** Result of jStat.models.ols(endog, exog). */
  export interface JStatOlsModel {
    nobs: number;
    df_model: number;
    df_resid: number;
    coef: number[];
    predict: number[];
    resid: number[];
    ybar: number;
    /** total sum of squares */
    SST: number;
    /**
     * Labelled SSE by jstat but holds the EXPLAINED (regression) sum of squares,
     * Σ(ŷ − ȳ)²: jstat swaps the usual SSE/SSR names.
     */
    SSE: number;
    /**
     * Labelled SSR by jstat but holds the RESIDUAL sum of squares, Σ(y − ŷ)².
     */
    SSR: number;
    R2: number;
    adjust_R2: number;
    t: {
      /** standard errors of the coefficients, in the order of the exog columns */
      se: number[];
      t: number[];
      p: number[];
      /** residual standard deviation, sqrt(SSR / df_resid) */
      sigmaHat: number;
      interval95: [number, number][];
    };
    f: { F_statistic: number; pvalue: number };
  }

  export interface JStatStatic {
    studentt: {
      pdf(x: number, dof: number): number;
      cdf(x: number, dof: number): number;
      inv(p: number, dof: number): number;
      mean(dof: number): number;
      variance(dof: number): number;
    };
    models: {
      /** Ordinary least squares; exog is the design matrix and must include a column of 1s. */
      ols(endog: number[], exog: number[][]): JStatOlsModel;
    };
  }

  const jStat: JStatStatic;
  export default jStat;
}
