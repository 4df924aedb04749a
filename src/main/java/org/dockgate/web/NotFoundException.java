package org.dockgate.web;

/** A record asked for by id or number does not exist: 404 with a problem document or the friendly page. */
public class NotFoundException extends RuntimeException {

    public NotFoundException(String message) {
        super(message);
    }

    /** For {@code optional.orElseThrow(NotFoundException.of("There is no lot 12."))}. */
    public static java.util.function.Supplier<NotFoundException> of(String message) {
        return () -> new NotFoundException(message);
    }
}
