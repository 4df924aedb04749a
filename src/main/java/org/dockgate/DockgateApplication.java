package org.dockgate;

import org.springframework.boot.SpringApplication;
import org.springframework.boot.autoconfigure.SpringBootApplication;
import org.springframework.boot.context.properties.ConfigurationPropertiesScan;

/** Dockgate: incoming inspection of sensor shipments. */
@SpringBootApplication
@ConfigurationPropertiesScan
public class DockgateApplication {

    public static void main(String[] args) {
        SpringApplication.run(DockgateApplication.class, args);
    }
}
