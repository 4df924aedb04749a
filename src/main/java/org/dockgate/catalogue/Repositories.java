package org.dockgate.catalogue;

import java.util.List;
import java.util.Optional;
import org.springframework.data.jpa.repository.JpaRepository;

interface SupplierRepository extends JpaRepository<Supplier, Long> {
    Optional<Supplier> findByCode(String code);

    List<Supplier> findAllByOrderByCodeAsc();
}

interface SensorModelRepository extends JpaRepository<SensorModel, Long> {
    Optional<SensorModel> findByPartNumber(String partNumber);

    List<SensorModel> findAllByOrderByPartNumberAsc();
}

interface SpecificationRevisionRepository extends JpaRepository<SpecificationRevisionRow, Long> {
    List<SpecificationRevisionRow> findByModelIdOrderByRevisionNoDesc(long modelId);

    Optional<SpecificationRevisionRow> findFirstByModelIdOrderByRevisionNoDesc(long modelId);
}
