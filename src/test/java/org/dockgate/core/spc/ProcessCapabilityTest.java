package org.dockgate.core.spc;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.decision.Tolerance;
import org.junit.jupiter.api.Test;

class ProcessCapabilityTest {

    /** REFERENCE.md A10 capability data, LSL 9.85, USL 10.15. */
    private static final double[] DATA = {
        10.02, 9.98, 10.05, 10.01, 9.97, 10.03, 10.00, 9.99, 10.04, 10.01, 9.96, 10.02};

    @Test
    void twoSidedIndicesWithTheSampleStandardDeviation() {
        // ISO 22514-2 / AIAG SPC manual formulas (from memory, REFERENCE.md §7.3 [M]) with the overall s, values
        // REFERENCE.md A10 [X] (named Pp, Ppk, PPU, PPL there), each to half a unit of its last printed digit
        ProcessCapability capability = ProcessCapability.of(DATA, Tolerance.between(9.85, 10.15));
        DescriptiveStatistics oracle = new DescriptiveStatistics(DATA); // Commons Math as an independent oracle
        assertAll(
                () -> assertEquals(12, capability.count()),
                () -> assertEquals(10.0066667, capability.mean(), 5e-8),
                () -> assertEquals(0.0277434, capability.standardDeviation(), 5e-8),
                () -> assertEquals(oracle.getStandardDeviation(), capability.standardDeviation(), 1e-15),
                () -> assertEquals(1.802230, capability.cp().getAsDouble(), 5e-7),
                () -> assertEquals(1.722130, capability.cpk(), 5e-7),
                () -> assertEquals(1.722130, capability.cpu().getAsDouble(), 5e-7),
                () -> assertEquals(1.882329, capability.cpl().getAsDouble(), 5e-7));
    }

    @Test
    void oneSidedSpecificationHasNoCp() {
        ProcessCapability upperOnly = ProcessCapability.of(DATA, Tolerance.atMost(10.15));
        assertTrue(upperOnly.cp().isEmpty());
        assertTrue(upperOnly.cpl().isEmpty());
        assertEquals(upperOnly.cpu().getAsDouble(), upperOnly.cpk());
        ProcessCapability lowerOnly = ProcessCapability.of(DATA, Tolerance.atLeast(9.85));
        assertEquals(1.882329, lowerOnly.cpk(), 5e-7);
    }

    @Test
    void meanOutsideTheLimitsGivesANegativeCpk() {
        ProcessCapability capability = ProcessCapability.of(DATA, Tolerance.between(10.1, 10.4));
        assertTrue(capability.cpk() < 0);
    }

    @Test
    void edgeCases() {
        Tolerance spec = Tolerance.between(0, 1);
        assertAll(
                () -> assertThrows(UnevaluableException.class, () -> ProcessCapability.of(new double[] {0.5}, spec)),
                () -> assertThrows(UnevaluableException.class,
                        () -> ProcessCapability.of(new double[] {0.5, 0.5, 0.5}, spec)),
                () -> assertThrows(IllegalArgumentException.class, () -> ProcessCapability.of(new double[0], spec)),
                () -> assertThrows(IllegalArgumentException.class,
                        () -> ProcessCapability.of(new double[] {0.5, Double.NaN}, spec)));
    }
}
