package org.dockgate.platform;

import java.util.Comparator;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import org.springframework.http.HttpMethod;

/**
 * What one feature module shows in the navigation and which roles may reach its URLs. Each module
 * declares one as a bean; the security configuration, the navigation and the 403 page all read the
 * same declarations, so what a role sees is what it may use.
 */
public record FeatureAccess(String feature, List<NavItem> navigation, List<AccessRule> rules) {

    public FeatureAccess {
        navigation = List.copyOf(navigation);
        rules = List.copyOf(rules);
    }

    /** A navigation entry: message key of its label and of its one-line description, and who sees it. */
    public record NavItem(String labelKey, String descriptionKey, String href, int order, Set<Role> roles) {
        public NavItem {
            roles = Set.copyOf(roles);
        }

        public boolean visibleTo(Set<Role> held) {
            return roles.stream().anyMatch(held::contains);
        }
    }

    /**
     * Roles allowed on a URL pattern (Spring path-pattern syntax, e.g. {@code /catalogue/**}), for one
     * HTTP method or all (method null).
     */
    public record AccessRule(String pattern, HttpMethod method, Set<Role> roles) {
        public AccessRule {
            roles = EnumSet.copyOf(roles);
        }

        public static AccessRule any(String pattern, Role... roles) {
            return new AccessRule(pattern, null, Set.of(roles));
        }

        public static AccessRule reads(String pattern, Role... roles) {
            return new AccessRule(pattern, HttpMethod.GET, Set.of(roles));
        }

        public static AccessRule writes(String pattern, Role... roles) {
            return new AccessRule(pattern, HttpMethod.POST, Set.of(roles));
        }

        /** Most specific first: longer literal prefix first, a method-specific rule before an all-method one. */
        static final Comparator<AccessRule> SPECIFIC_FIRST = Comparator
                .comparingInt((AccessRule r) -> -literalPrefix(r.pattern()).length())
                .thenComparing(r -> r.method() == null ? 1 : 0);

        private static String literalPrefix(String pattern) {
            int cut = pattern.length();
            for (String wildcard : new String[] {"*", "{"}) {
                int at = pattern.indexOf(wildcard);
                if (at >= 0) {
                    cut = Math.min(cut, at);
                }
            }
            return pattern.substring(0, cut);
        }
    }

    /** Every role: for pages and reads that anyone signed in may use. */
    public static Role[] everyone() {
        return Role.values();
    }
}
