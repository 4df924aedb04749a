package org.dockgate.demo;

/**
 * One step of loading the demo scenario from {@code seed-data/}. Steps run in {@link org.springframework.core.annotation.Order}
 * order, each in its own transaction, and each at most once per database.
 */
interface DemoStep {

    /** A stable name, recorded in {@code demo_seed_step} once loaded. */
    String name();

    void load(SeedFiles files);
}
