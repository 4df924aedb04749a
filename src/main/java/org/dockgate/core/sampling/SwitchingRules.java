package org.dockgate.core.sampling;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.OptionalInt;
import org.dockgate.core.UnevaluableException;

/**
 * The switching rules between normal, tightened and reduced inspection, and discontinuation, as a pure
 * state machine fed lot by lot with the results of original inspection.
 *
 * <p>ISO 2859-1:1999 clause 9 (default scheme):
 * <ul>
 * <li>9.3.1 normal → tightened when 2 out of 5 or fewer consecutive lots have been not accepted on
 * original inspection;</li>
 * <li>9.3.2 tightened → normal when 5 consecutive lots have been accepted on original inspection;</li>
 * <li>9.3.3 normal → reduced when the switching score is at least 30, production is at a steady rate
 * and the responsible authority considers reduced inspection desirable;</li>
 * <li>9.3.3.2 switching score, single sampling: set to 0 at the start of normal inspection; after each
 * lot on normal inspection, when Ac ≥ 2 add 3 if the lot would have been accepted at an AQL one step
 * tighter, otherwise reset to 0; when Ac is 0 or 1 add 2 if the lot is accepted, otherwise reset to 0;</li>
 * <li>9.3.4 reduced → normal when a lot is not accepted, production becomes irregular or delayed, or
 * other conditions warrant it ({@link #reinstateNormal(SwitchingState, String)});</li>
 * <li>9.4 discontinuation when the cumulative number of lots not accepted on tightened inspection
 * reaches 5; inspection resumes on tightened only after the supplier's corrective action has been
 * agreed ({@link #resume(SwitchingState, String)}).</li>
 * </ul>
 * Clause numbers follow SAMPLING.md section 7.1 (corroborated there by the GB/T 2828.1 adoption).
 *
 * <p>ANSI/ASQ Z1.4-2008 clause 8 (explicit choice): the same except normal → reduced after the preceding
 * 10 lots on normal inspection were all accepted (8.3.3 a), with steady production and the authority's
 * approval, and reduced → normal also when a lot is accepted with Ac &lt; d &lt; Re (8.3.4 b). The limit
 * numbers of Table VIII (8.3.3 b) are not applied: the values were not available in legible form, and
 * clause 8.5 allows dropping that requirement by agreement of supplier and customer — a contract that
 * uses Z1.4 with Dockgate must record that agreement.
 *
 * <p>Decisions documented here because the sources are silent: a lot judged under 100 % inspection
 * counts like any other lot; the switching score's "one step tighter" plan is read in the row of the
 * plan actually used ({@link SingleSamplingPlans#acceptNumberOneStepTighter(SamplingPlan)}); every
 * switch starts the counters of the new severity from zero (the window of 9.3.1 and the score start
 * afresh at each start of normal inspection, the tightened counters at each start of tightened).
 */
public final class SwitchingRules {

    private static final int TIGHTENED_TO_NORMAL_ACCEPTED = 5;
    private static final int DISCONTINUE_NOT_ACCEPTED = 5;
    private static final int REDUCED_SCORE = 30;
    private static final int Z14_REDUCED_LOTS = 10;

    private SwitchingRules() {
    }

    /**
     * Applies the switching rules to the result of one lot on original inspection.
     *
     * @param state the current state
     * @param lot the lot inspected under the plan for {@code state}'s severity and scheme
     * @return the next state and an explanation
     * @throws IllegalArgumentException when an argument is null or the lot's plan belongs to another
     *     severity or scheme than the state
     * @throws UnevaluableException when the procedures are discontinued (clause 9.4): no lot can be
     *     evaluated until {@link #resume(SwitchingState, String)}
     */
    public static SwitchingDecision next(SwitchingState state, LotResult lot) {
        if (state == null || lot == null) {
            throw new IllegalArgumentException("Switching needs a state and a lot result.");
        }
        if (state.discontinued()) {
            throw new UnevaluableException("Acceptance inspection is discontinued (" + clause(state, Rule.DISCONTINUE)
                    + "): no lot can be accepted under the scheme until the supplier's corrective action has been"
                    + " agreed and inspection is resumed on tightened inspection.");
        }
        SamplingPlan plan = lot.plan();
        if (plan.severity() != state.severity()) {
            throw new IllegalArgumentException("The lot was inspected with a " + name(plan.severity())
                    + " plan, but the switching state requires " + name(state.severity()) + " inspection.");
        }
        if (plan.scheme() != state.scheme()) {
            throw new IllegalArgumentException("The lot's plan belongs to " + plan.scheme()
                    + " but the switching state follows " + state.scheme() + ".");
        }
        return switch (state.severity()) {
            case NORMAL -> onNormal(state, lot);
            case TIGHTENED -> onTightened(state, lot);
            case REDUCED -> onReduced(state, lot);
        };
    }

    /**
     * Resumes inspection after discontinuation, on tightened inspection "as if 9.3.1 had been invoked"
     * (clause 9.4), once the supplier has acted to improve quality and the responsible authority has
     * agreed the action is likely to be effective.
     *
     * @param state a discontinued state
     * @param reason who agreed to which corrective action; recorded in the explanation
     * @return a fresh tightened state
     * @throws IllegalArgumentException when an argument is null or the reason is blank
     * @throws UnevaluableException when the state is not discontinued
     */
    public static SwitchingDecision resume(SwitchingState state, String reason) {
        Objects.requireNonNull(state, "state");
        requireReason(reason);
        if (!state.discontinued()) {
            throw new UnevaluableException("Inspection is not discontinued; only a discontinued scheme can be resumed.");
        }
        SwitchingState next = SwitchingState.start(state.scheme(), Severity.TIGHTENED);
        return new SwitchingDecision(state, next, "Inspection resumed on tightened inspection ("
                + clause(state, Rule.DISCONTINUE) + "). Reason: " + reason.trim());
    }

    /**
     * Reinstates normal inspection from reduced inspection because "other conditions warrant that normal
     * inspection be reinstated" (clause 9.3.4 c; Z1.4-2008 8.3.4 d), a decision the standard leaves to the
     * responsible authority.
     *
     * @param state a state on reduced inspection
     * @param reason why normal inspection is reinstated; recorded in the explanation
     * @return a fresh normal state
     * @throws IllegalArgumentException when an argument is null or the reason is blank
     * @throws UnevaluableException when the state is not on reduced inspection
     */
    public static SwitchingDecision reinstateNormal(SwitchingState state, String reason) {
        Objects.requireNonNull(state, "state");
        requireReason(reason);
        if (state.discontinued() || state.severity() != Severity.REDUCED) {
            throw new UnevaluableException("Normal inspection can be reinstated this way only from reduced inspection.");
        }
        SwitchingState next = SwitchingState.start(state.scheme(), Severity.NORMAL);
        return new SwitchingDecision(state, next, "Normal inspection reinstated from the next lot ("
                + clause(state, Rule.REDUCED_TO_NORMAL) + ", other conditions). Reason: " + reason.trim());
    }

    /**
     * Applies the responsible authority's approval of reduced inspection at the moment it is given: when
     * the state is on normal inspection and the other conditions of clause 9.3.3 already hold (switching
     * score at least 30 under ISO 2859-1:1999, 9.3.3 a; under ANSI/ASQ Z1.4-2008 the preceding 10 lots
     * accepted on normal inspection, 8.3.3 a) and production is at a steady rate (9.3.3 b), reduced
     * inspection applies from the next lot; otherwise the state is unchanged and the explanation names
     * what is still missing. The clause states conditions on the state, not on a lot, so an approval given
     * after the score was reached need not wait for another lot.
     *
     * @param state the current state
     * @param productionSteady whether production is at a steady rate (clause 9.3.3 b)
     * @return the next state and an explanation
     * @throws NullPointerException when {@code state} is null
     */
    public static SwitchingDecision approvalGiven(SwitchingState state, boolean productionSteady) {
        Objects.requireNonNull(state, "state");
        ReducedInspectionReadiness readiness = readiness(state, true, productionSteady);
        if (readiness.onReduced()) {
            return new SwitchingDecision(state, state, "Reduced inspection approved; inspection is already reduced.");
        }
        if (readiness.ready()) {
            return new SwitchingDecision(state, SwitchingState.start(state.scheme(), Severity.REDUCED),
                    "Reduced inspection approved by the responsible authority; "
                            + (state.scheme() == Scheme.ISO_2859_1_1999 ? "switching score " + state.switchingScore()
                            + " >= 30" : state.consecutiveAcceptedOnNormal() + " consecutive lots accepted on normal"
                            + " inspection") + " and production steady: reduced inspection from the next lot ("
                            + clause(state, Rule.NORMAL_TO_REDUCED) + ").");
        }
        return new SwitchingDecision(state, state, "Reduced inspection approved by the responsible authority; it"
                + " still needs " + String.join("; ", readiness.missing()) + ".");
    }

    /**
     * What is still missing for reduced inspection (clause 9.3.3 a–c; ANSI/ASQ Z1.4-2008 8.3.3 a, c, d;
     * the Table VIII limit numbers of 8.3.3 b are not applied, see the class comment): inspection must be
     * on normal (not discontinued, not tightened: tightened returns to normal after 5 consecutive accepted
     * lots, 9.3.2), the switching score at least 30 (ISO) or the preceding 10 lots accepted (Z1.4),
     * production steady and the responsible authority's approval.
     *
     * @param state the current state
     * @param approved whether the responsible authority considers reduced inspection desirable
     * @return the readiness; {@code onReduced} when already on reduced inspection
     * @throws NullPointerException when {@code state} is null
     */
    public static ReducedInspectionReadiness reducedReadiness(SwitchingState state, boolean approved) {
        Objects.requireNonNull(state, "state");
        return readiness(state, approved, approved);
    }

    private static ReducedInspectionReadiness readiness(SwitchingState state, boolean approved, boolean steady) {
        if (!state.discontinued() && state.severity() == Severity.REDUCED) {
            return new ReducedInspectionReadiness(true, List.of());
        }
        List<String> missing = new ArrayList<>();
        if (state.discontinued()) {
            missing.add("inspection resumed (discontinued, " + clause(state, Rule.DISCONTINUE) + "), then 5 consecutive"
                    + " lots accepted on tightened inspection to return to normal (" + clause(state, Rule.TIGHTENED_TO_NORMAL)
                    + ")");
        } else if (state.severity() == Severity.TIGHTENED) {
            missing.add("normal inspection first: " + state.consecutiveAcceptedOnTightened() + " of 5 consecutive lots"
                    + " accepted on tightened inspection (" + clause(state, Rule.TIGHTENED_TO_NORMAL) + ")");
        }
        boolean onNormal = !state.discontinued() && state.severity() == Severity.NORMAL;
        boolean iso = state.scheme() == Scheme.ISO_2859_1_1999;
        if (iso) {
            int score = onNormal ? state.switchingScore() : 0;
            if (score < REDUCED_SCORE) {
                missing.add("switching score " + score + " of " + REDUCED_SCORE + " (" + clause(state, Rule.NORMAL_TO_REDUCED)
                        + " a)");
            }
        } else {
            int lots = onNormal ? state.consecutiveAcceptedOnNormal() : 0;
            if (lots < Z14_REDUCED_LOTS) {
                missing.add(lots + " of " + Z14_REDUCED_LOTS + " preceding lots accepted on normal inspection ("
                        + clause(state, Rule.NORMAL_TO_REDUCED) + " a)");
            }
        }
        if (!steady && approved) {
            missing.add("steady production (" + clause(state, Rule.NORMAL_TO_REDUCED) + (iso ? " b)" : " c)"));
        }
        if (!approved) {
            missing.add("the responsible authority's approval of reduced inspection, which also confirms steady"
                    + " production (" + clause(state, Rule.NORMAL_TO_REDUCED) + (iso ? " b and c)" : " c and d)"));
        }
        return new ReducedInspectionReadiness(false, missing);
    }

    private static SwitchingDecision onNormal(SwitchingState state, LotResult lot) {
        boolean accepted = lot.accepted();
        StringBuilder text = new StringBuilder(lotSentence(lot, "normal"));

        List<Boolean> window = new ArrayList<>(state.recentNormalLotsAccepted());
        window.add(accepted);
        while (window.size() > SwitchingState.NORMAL_WINDOW) {
            window.remove(0);
        }
        long notAccepted = window.stream().filter(a -> !a).count();
        if (!accepted && notAccepted >= 2) {
            text.append(' ').append(notAccepted).append(" of the last ").append(window.size())
                    .append(" consecutive lots were not accepted on original inspection: tightened inspection from the"
                            + " next lot (").append(clause(state, Rule.NORMAL_TO_TIGHTENED)).append(").");
            return new SwitchingDecision(state, SwitchingState.start(state.scheme(), Severity.TIGHTENED), text.toString());
        }

        int score = nextScore(state.switchingScore(), lot, text, state);
        int consecutiveAccepted = accepted ? state.consecutiveAcceptedOnNormal() + 1 : 0;

        if (state.scheme() == Scheme.ISO_2859_1_1999) {
            if (score >= REDUCED_SCORE) {
                if (lot.productionSteady() && lot.reducedInspectionApproved()) {
                    text.append(" Switching score ").append(score).append(" >= 30, production steady and reduced inspection"
                            + " approved by the responsible authority: reduced inspection from the next lot (")
                            .append(clause(state, Rule.NORMAL_TO_REDUCED)).append(").");
                    return new SwitchingDecision(state, SwitchingState.start(state.scheme(), Severity.REDUCED),
                            text.toString());
                }
                text.append(" The score allows reduced inspection, but it also needs ")
                        .append(missingConditions(lot)).append(" (").append(clause(state, Rule.NORMAL_TO_REDUCED))
                        .append("); normal inspection continues.");
            }
        } else if (consecutiveAccepted >= Z14_REDUCED_LOTS) {
            if (lot.productionSteady() && lot.reducedInspectionApproved()) {
                text.append(' ').append(consecutiveAccepted).append(" consecutive lots accepted on normal inspection,"
                        + " production steady and reduced inspection approved: reduced inspection from the next lot (")
                        .append(clause(state, Rule.NORMAL_TO_REDUCED))
                        .append("; Table VIII limit numbers not applied, by agreement under clause 8.5).");
                return new SwitchingDecision(state, SwitchingState.start(state.scheme(), Severity.REDUCED),
                        text.toString());
            }
            text.append(' ').append(consecutiveAccepted).append(" consecutive lots accepted, but reduced inspection also"
                    + " needs ").append(missingConditions(lot)).append(" (").append(clause(state, Rule.NORMAL_TO_REDUCED))
                    .append("); normal inspection continues.");
        }
        if (state.scheme() == Scheme.ANSI_ASQ_Z1_4_2008 && consecutiveAccepted < Z14_REDUCED_LOTS) {
            text.append(' ').append(consecutiveAccepted).append(" consecutive lot(s) accepted on normal inspection; 10"
                    + " allow reduced inspection (").append(clause(state, Rule.NORMAL_TO_REDUCED)).append(").");
        }
        if (!accepted) {
            text.append(" This is the only lot not accepted among the last ").append(window.size())
                    .append(" on normal inspection; another within 5 consecutive lots switches to tightened inspection (")
                    .append(clause(state, Rule.NORMAL_TO_TIGHTENED)).append(").");
        }
        SwitchingState next = new SwitchingState(state.scheme(), Severity.NORMAL, false, window, score,
                consecutiveAccepted, 0, 0);
        return new SwitchingDecision(state, next, text.toString());
    }

    /** Clause 9.3.3.2 a), single sampling; appends the reason for the new score to {@code text}. */
    private static int nextScore(int score, LotResult lot, StringBuilder text, SwitchingState state) {
        SamplingPlan plan = lot.plan();
        int next;
        if (plan.acceptNumber() >= 2) {
            OptionalInt tighterAc = SingleSamplingPlans.acceptNumberOneStepTighter(plan);
            String tighterAql = plan.aql().tighter().map(Aql::label).orElse("none");
            if (tighterAc.isPresent() && lot.nonconforming() <= tighterAc.getAsInt()) {
                next = score + 3;
                text.append(" Switching score ").append(next).append(" (+3: it would also have been accepted at AQL ")
                        .append(tighterAql).append(", Ac ").append(tighterAc.getAsInt());
            } else {
                next = 0;
                text.append(" Switching score reset to 0 (it would not have been accepted at AQL ").append(tighterAql)
                        .append(tighterAc.isPresent() ? ", Ac " + tighterAc.getAsInt() : "");
            }
        } else if (lot.accepted()) {
            next = score + 2;
            text.append(" Switching score ").append(next).append(" (+2: accepted with Ac ").append(plan.acceptNumber());
        } else {
            next = 0;
            text.append(" Switching score reset to 0 (not accepted with Ac ").append(plan.acceptNumber());
        }
        text.append("; ISO 2859-1:1999 clause 9.3.3.2")
                .append(state.scheme() == Scheme.ISO_2859_1_1999 ? "" : ", informative under ANSI/ASQ Z1.4-2008")
                .append(").");
        return next;
    }

    private static SwitchingDecision onTightened(SwitchingState state, LotResult lot) {
        StringBuilder text = new StringBuilder(lotSentence(lot, "tightened"));
        if (lot.accepted()) {
            int consecutive = state.consecutiveAcceptedOnTightened() + 1;
            if (consecutive >= TIGHTENED_TO_NORMAL_ACCEPTED) {
                text.append(" 5 consecutive lots accepted on tightened inspection: normal inspection from the next lot (")
                        .append(clause(state, Rule.TIGHTENED_TO_NORMAL)).append(").");
                return new SwitchingDecision(state, SwitchingState.start(state.scheme(), Severity.NORMAL), text.toString());
            }
            text.append(' ').append(consecutive).append(" consecutive lot(s) accepted on tightened inspection; 5 return to"
                    + " normal (").append(clause(state, Rule.TIGHTENED_TO_NORMAL)).append(").");
            return new SwitchingDecision(state, new SwitchingState(state.scheme(), Severity.TIGHTENED, false, List.of(),
                    0, 0, consecutive, state.notAcceptedOnTightened()), text.toString());
        }
        int notAccepted = state.notAcceptedOnTightened() + 1;
        if (notAccepted >= DISCONTINUE_NOT_ACCEPTED) {
            text.append(" 5 lots not accepted since tightened inspection began: acceptance inspection is discontinued"
                    + " until the supplier's corrective action has been agreed (").append(clause(state, Rule.DISCONTINUE))
                    .append(").");
            return new SwitchingDecision(state, new SwitchingState(state.scheme(), Severity.TIGHTENED, true, List.of(),
                    0, 0, 0, notAccepted), text.toString());
        }
        text.append(' ').append(notAccepted).append(" lot(s) not accepted since tightened inspection began; 5 discontinue"
                + " inspection (").append(clause(state, Rule.DISCONTINUE)).append(").");
        return new SwitchingDecision(state, new SwitchingState(state.scheme(), Severity.TIGHTENED, false, List.of(),
                0, 0, 0, notAccepted), text.toString());
    }

    private static SwitchingDecision onReduced(SwitchingState state, LotResult lot) {
        StringBuilder text = new StringBuilder(lotSentence(lot, "reduced"));
        Disposition disposition = lot.disposition();
        String reason = null;
        if (disposition == Disposition.REJECT) {
            reason = "a lot was not accepted";
        } else if (disposition == Disposition.ACCEPT_AND_RETURN_TO_NORMAL) {
            reason = "the lot was accepted with more than Ac but fewer than Re nonconforming items (clause 10.1.4)";
        } else if (!lot.productionSteady()) {
            reason = "production is irregular or delayed";
        }
        if (reason != null) {
            text.append(" Normal inspection from the next lot because ").append(reason).append(" (")
                    .append(clause(state, Rule.REDUCED_TO_NORMAL)).append(").");
            return new SwitchingDecision(state, SwitchingState.start(state.scheme(), Severity.NORMAL), text.toString());
        }
        text.append(" Reduced inspection continues (").append(clause(state, Rule.REDUCED_TO_NORMAL))
                .append(" not triggered).");
        return new SwitchingDecision(state, state, text.toString());
    }

    private static String lotSentence(LotResult lot, String severity) {
        SamplingPlan plan = lot.plan();
        String outcome = switch (lot.disposition()) {
            case ACCEPT -> "accepted";
            case REJECT -> "not accepted";
            case ACCEPT_AND_RETURN_TO_NORMAL -> "accepted under the special reduced procedure";
        };
        return "Lot " + outcome + " on " + severity + " inspection: " + lot.nonconforming() + " nonconforming in "
                + (plan.fullInspection() ? "the whole lot of " : "a sample of ") + plan.sampleSize() + " (code letter "
                + plan.planCodeLetter() + ", AQL " + plan.aql().label() + ", Ac " + plan.acceptNumber() + ", Re "
                + plan.rejectNumber() + ").";
    }

    private static String missingConditions(LotResult lot) {
        if (!lot.productionSteady() && !lot.reducedInspectionApproved()) {
            return "steady production and the responsible authority's approval";
        }
        return lot.productionSteady() ? "the responsible authority's approval" : "steady production";
    }

    private static void requireReason(String reason) {
        if (reason == null || reason.isBlank()) {
            throw new IllegalArgumentException("A reason is required for this switching decision.");
        }
    }

    private static String name(Severity severity) {
        return severity.name().toLowerCase(java.util.Locale.ROOT);
    }

    private enum Rule {
        NORMAL_TO_TIGHTENED("9.3.1", "8.3.1"),
        TIGHTENED_TO_NORMAL("9.3.2", "8.3.2"),
        NORMAL_TO_REDUCED("9.3.3", "8.3.3"),
        REDUCED_TO_NORMAL("9.3.4", "8.3.4"),
        DISCONTINUE("9.4", "8.4");

        private final String iso;
        private final String z14;

        Rule(String iso, String z14) {
            this.iso = iso;
            this.z14 = z14;
        }
    }

    private static String clause(SwitchingState state, Rule rule) {
        return state.scheme() == Scheme.ISO_2859_1_1999
                ? "ISO 2859-1:1999 clause " + rule.iso
                : "ANSI/ASQ Z1.4-2008 clause " + rule.z14;
    }
}
