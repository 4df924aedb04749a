package org.dockgate.core;

/**
 * Input that is well-formed but from which the requested figure cannot be computed, for example a
 * calibration series with fewer than two distinct inputs. Malformed input (NaN, an empty list, an
 * unknown name) is an {@link IllegalArgumentException} instead; the web layer answers the first with
 * 422 and the second with 400.
 */
public class UnevaluableException extends RuntimeException {

    public UnevaluableException(String message) {
        super(message);
    }
}
