/**
 * Evaluation of one sampled unit against its procedure: each metric the procedure accepts on is computed
 * from the unit's readings with the core's metrics, given an uncertainty budget (Type A from the readings,
 * Type B from the reference certificate, the readout resolution and the environment, combined after
 * JCGM 100:2008), an expanded uncertainty at 95.45 % with k from the Welch–Satterthwaite degrees of freedom,
 * and a verdict under the procedure's decision rule. The unit's verdict is the worst of its metrics';
 * {@link org.dockgate.core.evaluation.LotTally} counts nonconforming units for the lot disposition.
 *
 * <p>Entry point: {@link org.dockgate.core.evaluation.UnitEvaluation#evaluate}. Results are partial while
 * readings are missing ({@link org.dockgate.core.evaluation.UnitResult#complete()} is then false and
 * {@link org.dockgate.core.evaluation.UnitResult#missing()} names what is missing), so a bench page can show
 * live verdicts as readings arrive.
 */
package org.dockgate.core.evaluation;
