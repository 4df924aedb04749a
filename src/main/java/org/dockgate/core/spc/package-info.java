/**
 * Supplier reject rates and process statistics: the Wilson score interval for a proportion, the p-chart with
 * variable subgroup sizes and its rule-1 signal, and process capability indices.
 */
package org.dockgate.core.spc;
