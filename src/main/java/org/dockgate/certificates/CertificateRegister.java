package org.dockgate.certificates;

import com.lowagie.text.pdf.PdfReader;
import java.io.IOException;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Clock;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Collectors;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.dao.DuplicateKeyException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.security.authentication.AnonymousAuthenticationToken;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.TransactionDefinition;
import org.springframework.transaction.annotation.Transactional;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The register of issued certificates: numbers them, has them rendered and signed, keeps each signed
 * PDF with its SHA-256 and signer, and supersedes a certificate by a reissue. Entries are append-only
 * (the database refuses UPDATE and DELETE, V9_3): a reissue is a new certificate with a new number that
 * cites the one it replaces, plus a supersession row; nothing is ever overwritten.
 *
 * <p>The signed PDF is stored in the database row (not in the data folder), so the entry, its bytes
 * and its hash are written in one transaction, backed up together and guarded by the same trigger.
 */
@Service
public class CertificateRegister {

    private static final String COLUMNS = "c.id, c.certificate_number, c.revision, c.replaces_number, c.reissue_reason,"
            + " c.lot_id, c.lot_reference, c.supplier, c.signer_username, c.signer_name, c.signing_identity_id,"
            + " c.signer_certificate_sha256, c.meaning, c.signed_at, c.pdf_sha256, c.pdf_size,"
            + " s.replacement_number, s.superseded_at, s.reason as supersession_reason";
    private static final String FROM = " from issued_certificate c"
            + " left join certificate_supersession s on s.superseded_number = c.certificate_number";

    private final JdbcTemplate jdbc;
    private final SigningService signing;
    private final ApplicationEventPublisher events;
    private final Clock clock;
    private final TransactionTemplate separate;
    private final String prefix;

    CertificateRegister(JdbcTemplate jdbc, SigningService signing, ApplicationEventPublisher events, Clock clock,
                        PlatformTransactionManager transactions,
                        @Value("${dockgate.certificates.number-prefix:DG}") String prefix) {
        this.jdbc = jdbc;
        this.signing = signing;
        this.events = events;
        this.clock = clock;
        this.separate = new TransactionTemplate(transactions);
        this.separate.setPropagationBehavior(TransactionDefinition.PROPAGATION_REQUIRES_NEW);
        this.prefix = prefix;
    }

    /**
     * Issues a certificate: takes the next number ({@code DG-<year>-<nnnnnn>}), has the renderer build the
     * PDF for it, signs it as {@code signerUsername} with the given meaning and registers it. All in one
     * transaction: if anything fails, no number is used and nothing is stored.
     *
     * <p>The signer must be the person signed in (a certificate is never signed in someone else's name);
     * the caller re-checks their password and the separation of duties before calling.
     */
    @Transactional
    public IssuedCertificate issue(CertificateSubject subject, String signerUsername, String meaning,
                                   CertificateRenderer renderer) {
        requireSignedInAs(signerUsername);
        String number = nextNumber();
        return register(CertificateHeading.first(number), subject, signerUsername, meaning, renderer);
    }

    /**
     * Reissues a certificate as a correction: a new certificate (new number, revision + 1) that names the
     * one it replaces and why; the old one becomes SUPERSEDED (a supersession row, never an update). A
     * superseded certificate cannot be reissued again: reissue its replacement.
     */
    @Transactional
    public IssuedCertificate reissue(String oldNumber, String reason, CertificateSubject subject,
                                     String signerUsername, String meaning, CertificateRenderer renderer) {
        requireSignedInAs(signerUsername);
        if (reason == null || reason.isBlank()) {
            throw new IllegalArgumentException("A reissue needs its reason.");
        }
        String why = reason.strip();
        if (why.length() > 2000) {
            throw new IllegalArgumentException("The reason for a reissue is at most 2000 characters.");
        }
        IssuedCertificate old = find(oldNumber).orElseThrow(() ->
                new IllegalArgumentException("There is no certificate " + oldNumber + " in the register."));
        if (old.superseded()) {
            throw new IllegalStateException("Certificate " + old.certificateNumber() + " is already superseded by "
                    + old.supersededBy() + "; reissue that one instead.");
        }
        String number = nextNumber();
        IssuedCertificate issued = register(new CertificateHeading(number, old.revision() + 1,
                old.certificateNumber(), why), subject, signerUsername, meaning, renderer);
        try {
            jdbc.update("insert into certificate_supersession (superseded_number, replacement_number, reason,"
                            + " superseded_at, superseded_by) values (?, ?, ?, ?, ?)", old.certificateNumber(), number,
                    why, issued.signedAt().atOffset(ZoneOffset.UTC), signerUsername);
        } catch (DuplicateKeyException e) {
            throw new IllegalStateException("Certificate " + old.certificateNumber()
                    + " was superseded by another reissue meanwhile; nothing was issued.");
        }
        events.publishEvent(AuditEvent.withReason("CERTIFICATE", old.certificateNumber(), "SUPERSEDE",
                        "Certificate " + old.certificateNumber() + " superseded by " + number, why)
                .withChanges(List.of(FieldChange.of("status", "ISSUED", "SUPERSEDED"),
                        FieldChange.of("supersededBy", null, number))));
        return find(number).orElseThrow();
    }

    @Transactional(readOnly = true)
    public Optional<IssuedCertificate> find(String certificateNumber) {
        if (certificateNumber == null || certificateNumber.isBlank()) {
            return Optional.empty();
        }
        return withSerials(jdbc.query("select " + COLUMNS + FROM + " where c.certificate_number = ?",
                this::row, certificateNumber.strip())).stream().findFirst();
    }

    /** The entry whose stored PDF has this SHA-256, if any. */
    @Transactional(readOnly = true)
    public Optional<IssuedCertificate> findBySha256(String sha256) {
        if (sha256 == null) {
            return Optional.empty();
        }
        return withSerials(jdbc.query("select " + COLUMNS + FROM + " where c.pdf_sha256 = ?", this::row,
                sha256.toLowerCase())).stream().findFirst();
    }

    /** The signed PDF exactly as issued. */
    @Transactional(readOnly = true)
    public Optional<byte[]> pdf(String certificateNumber) {
        return jdbc.query("select pdf from issued_certificate where certificate_number = ?",
                (rs, i) -> rs.getBytes(1), certificateNumber).stream().findFirst();
    }

    /** Entries matching every given criterion, newest first. */
    @Transactional(readOnly = true)
    public List<IssuedCertificate> search(CertificateQuery query) {
        StringBuilder sql = new StringBuilder("select " + COLUMNS + FROM + " where 1 = 1");
        List<Object> args = new ArrayList<>();
        if (query.number() != null) {
            sql.append(" and lower(c.certificate_number) like ?");
            args.add(like(query.number()));
        }
        if (query.lot() != null) {
            sql.append(" and (lower(c.lot_reference) like ?");
            args.add(like(query.lot()));
            if (query.lot().matches("\\d{1,18}")) {
                sql.append(" or c.lot_id = ?");
                args.add(Long.parseLong(query.lot()));
            }
            sql.append(")");
        }
        if (query.supplier() != null) {
            sql.append(" and lower(c.supplier) like ?");
            args.add(like(query.supplier()));
        }
        if (query.serial() != null) {
            sql.append(" and exists (select 1 from issued_certificate_serial u where u.certificate_number"
                    + " = c.certificate_number and lower(u.serial) like ?)");
            args.add(like(query.serial()));
        }
        if (query.from() != null) {
            sql.append(" and c.signed_at >= ?");
            args.add(query.from().atStartOfDay().atOffset(ZoneOffset.UTC));
        }
        if (query.to() != null) {
            sql.append(" and c.signed_at < ?");
            args.add(query.to().plusDays(1).atStartOfDay().atOffset(ZoneOffset.UTC));
        }
        sql.append(" order by c.signed_at desc, c.id desc limit ?");
        args.add(query.effectiveLimit());
        return withSerials(jdbc.query(sql.toString(), this::row, args.toArray()));
    }

    // ---------------------------------------------------------------- internals

    private IssuedCertificate register(CertificateHeading heading, CertificateSubject subject, String signerUsername,
                                       String meaning, CertificateRenderer renderer) {
        if (subject == null) {
            throw new IllegalArgumentException("A certificate needs its subject (lot, supplier, serials).");
        }
        byte[] unsigned = renderer.render(heading);
        requireCarriesNumber(unsigned, heading.certificateNumber());
        SignedDocument signed = signing.sign(unsigned, signerUsername, meaning);
        jdbc.update("insert into issued_certificate (certificate_number, revision, replaces_number, reissue_reason,"
                        + " lot_id, lot_reference, supplier, signer_username, signer_name, signing_identity_id,"
                        + " signer_certificate_sha256, meaning, signed_at, pdf_sha256, pdf_size, pdf)"
                        + " values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)",
                heading.certificateNumber(), heading.revision(), heading.replacesNumber(), heading.reissueReason(),
                subject.lotId(), subject.lotReference(), subject.supplier(), signed.signerUsername(),
                signed.signerName(), signed.signingIdentityId(), signed.certificateFingerprintSha256(),
                signed.meaning(), signed.signedAt().atOffset(ZoneOffset.UTC), signed.sha256(),
                (long) signed.pdf().length, signed.pdf());
        for (String serial : subject.serials()) {
            jdbc.update("insert into issued_certificate_serial (certificate_number, serial) values (?, ?)",
                    heading.certificateNumber(), serial);
        }
        List<FieldChange> changes = List.of(FieldChange.of("revision", null, heading.revision()),
                FieldChange.of("lot", null, subject.lotReference() != null ? subject.lotReference() : subject.lotId()),
                FieldChange.of("supplier", null, subject.supplier()),
                FieldChange.of("serials", null, String.join(", ", subject.serials())),
                FieldChange.of("signer", null, signed.signerUsername()),
                FieldChange.of("meaning", null, signed.meaning()),
                FieldChange.of("pdfSha256", null, signed.sha256()));
        if (heading.reissue()) {
            events.publishEvent(AuditEvent.withReason("CERTIFICATE", heading.certificateNumber(), "REISSUE",
                            "Certificate " + heading.certificateNumber() + " issued, replacing " + heading.replacesNumber(),
                            heading.reissueReason())
                    .withChanges(changes));
        } else {
            events.publishEvent(AuditEvent.of("CERTIFICATE", heading.certificateNumber(), "ISSUE",
                    "Certificate " + heading.certificateNumber() + " issued (" + signed.meaning() + ")").withChanges(changes));
        }
        return find(heading.certificateNumber()).orElseThrow();
    }

    /** The next number of the current year (UTC), under a row lock held until the issuing transaction ends. */
    private String nextNumber() {
        int year = clock.instant().atOffset(ZoneOffset.UTC).getYear();
        // The year's counter row is created in a transaction of its own, so a concurrent first issue of the
        // year (a duplicate insert) cannot abort the issuing transaction on PostgreSQL.
        separate.executeWithoutResult(status -> {
            Long rows = jdbc.queryForObject("select count(*) from certificate_number_counter where number_year = ?",
                    Long.class, year);
            if (rows == null || rows == 0) {
                try {
                    jdbc.update("insert into certificate_number_counter (number_year, last_number) values (?, 0)", year);
                } catch (DuplicateKeyException e) {
                    status.setRollbackOnly();
                }
            }
        });
        Long last = jdbc.queryForObject("select last_number from certificate_number_counter where number_year = ?"
                + " for update", Long.class, year);
        long next = (last == null ? 0 : last) + 1;
        jdbc.update("update certificate_number_counter set last_number = ? where number_year = ?", next, year);
        return String.format("%s-%d-%06d", prefix, year, next);
    }

    private static void requireCarriesNumber(byte[] pdf, String number) {
        if (pdf == null || pdf.length == 0) {
            throw new IllegalStateException("The certificate renderer returned no PDF.");
        }
        PdfReader reader = null;
        try {
            reader = new PdfReader(pdf);
            String carried = reader.getInfo().get(CertificatePdfWriter.INFO_CERTIFICATE_NUMBER);
            if (!number.equals(carried)) {
                throw new IllegalStateException("The rendered PDF does not carry the certificate number " + number
                        + "; build it with CertificatePdfWriter.open(heading, title).");
            }
        } catch (IOException e) {
            throw new IllegalStateException("The certificate renderer returned an unreadable PDF.");
        } finally {
            if (reader != null) {
                reader.close();
            }
        }
    }

    private static void requireSignedInAs(String signerUsername) {
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        if (auth == null || auth instanceof AnonymousAuthenticationToken || !auth.isAuthenticated()
                || signerUsername == null || !auth.getName().equals(signerUsername)) {
            throw new IllegalStateException("A certificate is signed by the person who is signed in; "
                    + signerUsername + " is not.");
        }
    }

    private List<IssuedCertificate> withSerials(List<IssuedCertificate> found) {
        if (found.isEmpty()) {
            return found;
        }
        Map<String, List<String>> serials = new HashMap<>();
        String placeholders = found.stream().map(c -> "?").collect(Collectors.joining(", "));
        jdbc.query("select certificate_number, serial from issued_certificate_serial where certificate_number in ("
                        + placeholders + ") order by serial",
                rs -> {
                    serials.computeIfAbsent(rs.getString(1), k -> new ArrayList<>()).add(rs.getString(2));
                }, found.stream().map(IssuedCertificate::certificateNumber).toArray());
        return found.stream().map(c -> new IssuedCertificate(c.id(), c.certificateNumber(), c.revision(),
                c.replacesNumber(), c.reissueReason(), c.lotId(), c.lotReference(), c.supplier(),
                serials.getOrDefault(c.certificateNumber(), List.of()), c.signerUsername(), c.signerName(),
                c.signingIdentityId(), c.signerCertificateSha256(), c.meaning(), c.signedAt(), c.pdfSha256(),
                c.pdfSize(), c.status(), c.supersededBy(), c.supersededAt(), c.supersessionReason())).toList();
    }

    private IssuedCertificate row(ResultSet rs, int i) throws SQLException {
        String replacement = rs.getString("replacement_number");
        long lotId = rs.getLong("lot_id");
        Long lot = rs.wasNull() ? null : lotId;
        return new IssuedCertificate(rs.getLong("id"), rs.getString("certificate_number"), rs.getInt("revision"),
                rs.getString("replaces_number"), rs.getString("reissue_reason"), lot, rs.getString("lot_reference"),
                rs.getString("supplier"), List.of(), rs.getString("signer_username"), rs.getString("signer_name"),
                rs.getLong("signing_identity_id"), rs.getString("signer_certificate_sha256"), rs.getString("meaning"),
                instant(rs, "signed_at"), rs.getString("pdf_sha256"), rs.getLong("pdf_size"),
                replacement == null ? IssuedCertificate.Status.ISSUED : IssuedCertificate.Status.SUPERSEDED,
                replacement, instant(rs, "superseded_at"), rs.getString("supersession_reason"));
    }

    private static Instant instant(ResultSet rs, String column) throws SQLException {
        OffsetDateTime value = rs.getObject(column, OffsetDateTime.class);
        return value == null ? null : value.toInstant();
    }

    private static String like(String text) {
        return "%" + text.toLowerCase().replace("\\", "\\\\").replace("%", "\\%").replace("_", "\\_") + "%";
    }
}
