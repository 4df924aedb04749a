package org.dockgate.certificates;

import java.util.List;
import java.util.Optional;
import org.dockgate.accounts.AccountService;
import org.dockgate.accounts.Person;
import org.dockgate.evaluation.DispositionAction;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.evaluation.LotEvaluationView;
import org.dockgate.platform.Role;
import org.dockgate.receiving.LotState;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Approval and signing of a dispositioned lot's certificate of conformance: re-authentication at the
 * moment of signing, the signature's meaning from the lot's decision, separation of duties (nobody signs
 * alone for readings they recorded), and issue or reissue through the register.
 */
@Service
public class LotCertificateService {

    private final EvaluationService evaluation;
    private final AccountService accounts;
    private final CertificateRegister register;
    private final LotCertificateRenderer renderer;

    LotCertificateService(EvaluationService evaluation, AccountService accounts, CertificateRegister register,
                          LotCertificateRenderer renderer) {
        this.evaluation = evaluation;
        this.accounts = accounts;
        this.register = register;
        this.renderer = renderer;
    }

    /** What the signature will mean, shown on the page before signing. */
    @Transactional(readOnly = true)
    public String meaning(long lotId) {
        return meaning(evaluation.lotEvaluation(lotId));
    }

    static String meaning(LotEvaluationView ev) {
        if (ev.lot().state() == LotState.DISPOSITIONED_ACCEPTED) {
            return "Approved for release";
        }
        DispositionAction action = ev.nonconformance().map(n -> n.action()).orElse(DispositionAction.RETURN_TO_SUPPLIER);
        return switch (action) {
            case RETURN_TO_SUPPLIER -> "Rejected — return to supplier";
            case SCREEN_100_PERCENT -> "Rejected — 100 % screening before use";
            case USE_AS_IS_CONCESSION -> "Rejected — released for use as is under concession";
            case SCRAP -> "Rejected — scrap";
        };
    }

    /**
     * The title of the lot's document by outcome: "Certificate of conformance" (accepted), "Certificate of
     * release under concession" (rejected, concession approved) or "Inspection report" (rejected).
     */
    @Transactional(readOnly = true)
    public String documentTitle(long lotId) {
        return LotCertificateRenderer.title(evaluation.lotEvaluation(lotId));
    }

    /** The certificates already issued for a lot, newest first. */
    @Transactional(readOnly = true)
    public List<IssuedCertificate> forLot(long lotId) {
        return register.search(new CertificateQuery(null, String.valueOf(lotId), null, null, null, null, null)).stream()
                .filter(c -> Long.valueOf(lotId).equals(c.lotId())).toList();
    }

    /**
     * Approves and signs the lot's certificate as the signed-in person, after checking their password
     * again. Refused: a lot not yet dispositioned; a concession not yet approved; a person without ENGINEER
     * or SUPERVISOR; a person who recorded readings of this lot (separation of duties); a wrong password;
     * a lot that already has a current certificate (reissue it instead).
     */
    @Transactional
    public IssuedCertificate approveAndSign(long lotId, String password) {
        String username = signedIn();
        LotEvaluationView ev = requireSignable(lotId, username, password);
        if (forLot(lotId).stream().anyMatch(c -> !c.superseded())) {
            throw new IllegalStateException("Lot " + lotId + " already has a current certificate; reissue it with a reason to correct it.");
        }
        return register.issue(subject(ev), username, meaning(ev), heading -> renderer.render(heading, ev, username));
    }

    /** A correction: a new certificate revision that cites the one it replaces and why. */
    @Transactional
    public IssuedCertificate reissue(String oldNumber, String reason, String password) {
        String username = signedIn();
        IssuedCertificate old = register.find(oldNumber)
                .orElseThrow(() -> new IllegalArgumentException("There is no certificate " + oldNumber + "."));
        if (old.lotId() == null) {
            throw new IllegalStateException("Certificate " + oldNumber + " does not belong to a lot.");
        }
        LotEvaluationView ev = requireSignable(old.lotId(), username, password);
        return register.reissue(oldNumber, reason, subject(ev), username, meaning(ev),
                heading -> renderer.render(heading, ev, username));
    }

    private LotEvaluationView requireSignable(long lotId, String username, String password) {
        Person person = accounts.byUsername(username)
                .orElseThrow(() -> new IllegalStateException("Sign in to approve a certificate."));
        if (!accounts.passwordMatches(username, password)) {
            throw new IllegalArgumentException("The password is not correct: the certificate was not signed.");
        }
        if (!person.has(Role.ENGINEER) && !person.has(Role.SUPERVISOR)) {
            throw new IllegalStateException("Approving a certificate needs the role ENGINEER or SUPERVISOR.");
        }
        LotEvaluationView ev = evaluation.lotEvaluation(lotId);
        if (ev.lot().state() == LotState.AWAITING_MEASUREMENT) {
            throw new IllegalStateException("Lot " + lotId + " is not dispositioned yet.");
        }
        if (ev.nonconformance().map(n -> n.awaitingConcession()).orElse(false)) {
            throw new IllegalStateException("The concession for lot " + lotId + " waits for a supervisor's approval.");
        }
        boolean recorded = ev.units().stream().anyMatch(u -> u.operators().contains(username));
        if (recorded) {
            throw new IllegalStateException("You recorded readings of this lot, so you cannot approve its certificate:"
                    + " another engineer or a supervisor must sign (separation of duties).");
        }
        return ev;
    }

    /** Every serial of the lot, sampled or not, so the register finds the certificate by any unit's serial. */
    private static CertificateSubject subject(LotEvaluationView ev) {
        return new CertificateSubject(ev.lot().id(), "Lot " + ev.lot().id() + " " + ev.lot().partNumber(),
                ev.lot().supplierCode(), ev.lot().serials());
    }

    private static String signedIn() {
        var auth = SecurityContextHolder.getContext().getAuthentication();
        return Optional.ofNullable(auth).map(a -> a.getName())
                .orElseThrow(() -> new IllegalStateException("Sign in to approve a certificate."));
    }
}
