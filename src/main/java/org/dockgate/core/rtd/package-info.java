/**
 * Platinum resistance thermometers after IEC 60751: the Callendar–Van Dusen equation in both
 * directions, its local sensitivity, and the tolerance classes AA, A, B and C.
 */
package org.dockgate.core.rtd;
