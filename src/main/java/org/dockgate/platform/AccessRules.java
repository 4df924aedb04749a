package org.dockgate.platform;

import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;
import org.dockgate.platform.FeatureAccess.AccessRule;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.springframework.http.server.PathContainer;
import org.springframework.stereotype.Component;
import org.springframework.web.util.pattern.PathPattern;
import org.springframework.web.util.pattern.PathPatternParser;

/** All modules' access declarations in one ordered list. */
@Component
public class AccessRules {

    private final List<AccessRule> rules;
    private final List<NavItem> navigation;

    AccessRules(List<FeatureAccess> features) {
        this.rules = features.stream().flatMap(f -> f.rules().stream())
                .sorted(AccessRule.SPECIFIC_FIRST).toList();
        this.navigation = features.stream().flatMap(f -> f.navigation().stream())
                .sorted(Comparator.comparingInt(NavItem::order)).toList();
    }

    /** Rules, most specific first (the order Spring Security must see them in). */
    public List<AccessRule> rules() {
        return rules;
    }

    /** The navigation entries a person holding these roles may use. */
    public List<NavItem> navigationFor(Set<Role> held) {
        return navigation.stream().filter(item -> item.visibleTo(held)).toList();
    }

    /** The rule that decides a request, used to name the role a refused person would need. */
    public Optional<AccessRule> ruleFor(String path, String method) {
        PathContainer container = PathContainer.parsePath(path);
        for (AccessRule rule : rules) {
            PathPattern pattern = PathPatternParser.defaultInstance.parse(rule.pattern());
            if (pattern.matches(container)
                    && (rule.method() == null || rule.method().matches(method)
                        || rule.method().matches("GET") && "HEAD".equalsIgnoreCase(method))) {
                return Optional.of(rule);
            }
        }
        return Optional.empty();
    }

    /** "ENGINEER or SUPERVISOR", for the 403 page. */
    public static String describe(Set<Role> roles) {
        return roles.stream().sorted().map(Role::name).collect(Collectors.joining(" or "));
    }
}
