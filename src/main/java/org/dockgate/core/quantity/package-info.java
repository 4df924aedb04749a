/**
 * Units of measure: engineers' unit symbols parsed through UCUM into JSR 385 units (Indriya),
 * dimension checks and cached conversions.
 */
package org.dockgate.core.quantity;
