package org.dockgate.certificates;

import java.util.List;
import java.util.Optional;

/**
 * What the signing-identities page shows at the top.
 *
 * @param demoKey       the key store is protected by the published demo password: its keys prove nothing
 * @param issuing       the CA that issues new signing certificates (empty if none can)
 * @param keyStoreFile  where the keys are kept (back this file up with its password)
 */
public record SigningOverview(boolean demoKey, Optional<SigningAuthority> issuing, String keyStoreFile,
                              List<SigningAuthority> authorities, List<SigningIdentity> identities) {
}
