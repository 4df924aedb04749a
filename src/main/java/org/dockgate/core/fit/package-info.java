/**
 * Least-squares straight-line fit, checked against the NIST StRD Norris certified values.
 */
package org.dockgate.core.fit;
