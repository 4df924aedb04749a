package org.dockgate.demo;

import java.util.Map;
import org.dockgate.certificates.LotCertificateService;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;

/**
 * Signed certificates for the demo's dispositioned lots, approved by people who recorded none of their
 * readings: the second engineer signs the accepted lots, the supervisor the rejected one. Passwords are
 * the documented demo passwords (seed-data/accounts.csv), re-entered as at the signing page.
 */
@Component
@Order(800)
class DemoCertificates implements DemoStep {

    private final ReceivingService receiving;
    private final LotCertificateService certificates;

    DemoCertificates(ReceivingService receiving, LotCertificateService certificates) {
        this.receiving = receiving;
        this.certificates = certificates;
    }

    @Override
    public String name() {
        return "certificates";
    }

    @Override
    public void load(SeedFiles files) {
        Map<String, String> passwords = new java.util.HashMap<>();
        files.csv("accounts.csv").forEach(row -> passwords.put(row.get("username"), row.get("password")));
        for (LotState state : new LotState[] {LotState.DISPOSITIONED_ACCEPTED, LotState.DISPOSITIONED_REJECTED}) {
            String signer = state == LotState.DISPOSITIONED_ACCEPTED ? "engineer2" : "supervisor";
            for (LotView lot : receiving.lots(state)) {
                if (certificates.forLot(lot.id()).isEmpty()) {
                    DemoLoader.as(signer, () -> certificates.approveAndSign(lot.id(), passwords.get(signer)));
                }
            }
        }
    }
}
