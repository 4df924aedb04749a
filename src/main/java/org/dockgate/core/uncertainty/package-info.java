/**
 * Measurement uncertainty after JCGM 100:2008 (GUM): Type A and Type B standard uncertainties, sensitivity
 * coefficients, the combined standard uncertainty of uncorrelated inputs (GUM 5.1.2), the Welch–Satterthwaite
 * effective degrees of freedom (GUM G.4.1, Eq. G.2b) and the coverage factor from Student's t (GUM G.6.4).
 *
 * <p>Start with {@link org.dockgate.core.uncertainty.UncertaintyBudget#builder()}. Infinite degrees of freedom
 * are {@link java.lang.Double#POSITIVE_INFINITY}. Malformed input throws {@link IllegalArgumentException};
 * well-formed input that cannot be evaluated (a single reading) throws
 * {@link org.dockgate.core.UnevaluableException}.
 */
package org.dockgate.core.uncertainty;
