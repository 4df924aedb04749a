package org.dockgate.instruments;

import java.util.Optional;
import org.springframework.data.jpa.repository.JpaRepository;

interface ReferenceInstrumentRepository extends JpaRepository<ReferenceInstrument, Long> {

    Optional<ReferenceInstrument> findByIdentifier(String identifier);

    boolean existsByIdentifier(String identifier);
}
