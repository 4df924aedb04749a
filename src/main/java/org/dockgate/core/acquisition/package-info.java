/**
 * Data-acquisition files: the documented CSV format of one reading per line
 * ({@code serial,test,point,direction,cycle,value,unit}) and a streaming parser that validates each row,
 * converts units with {@link org.dockgate.core.quantity.Units} and hands valid readings to a consumer, so a
 * file of millions of rows never has to be held in memory. The format is described in DEVELOPERS.md,
 * "Data-acquisition CSV format".
 */
package org.dockgate.core.acquisition;
