package org.dockgate.web;

import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import org.dockgate.platform.AccessRules;
import org.dockgate.platform.FeatureAccess.NavItem;
import org.dockgate.platform.Role;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.GrantedAuthority;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Controller;
import org.springframework.web.bind.annotation.ControllerAdvice;
import org.springframework.web.bind.annotation.ModelAttribute;

/** Puts the navigation the signed-in person may use into every page's model. */
@ControllerAdvice(annotations = Controller.class)
class LayoutAdvice {

    private final AccessRules rules;
    private final java.time.ZoneId labZone;

    LayoutAdvice(AccessRules rules,
                 @org.springframework.beans.factory.annotation.Value("${dockgate.lab.time-zone:UTC}") String labZone) {
        this.rules = rules;
        this.labZone = java.time.ZoneId.of(labZone);
    }

    /** The zone pages print times in, with {@code ResultFormat.dateTime(instant, labZone)} (to the second). */
    @ModelAttribute("labZone")
    java.time.ZoneId labZone() {
        return labZone;
    }

    @ModelAttribute("navigation")
    List<NavItem> navigation() {
        return rules.navigationFor(currentRoles());
    }

    @ModelAttribute("currentPath")
    String currentPath(jakarta.servlet.http.HttpServletRequest request) {
        return request.getRequestURI().substring(request.getContextPath().length());
    }

    @ModelAttribute("currentRoles")
    Set<Role> currentRoles() {
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        Set<Role> held = EnumSet.noneOf(Role.class);
        if (auth == null || !auth.isAuthenticated()) {
            return held;
        }
        for (GrantedAuthority authority : auth.getAuthorities()) {
            for (Role role : Role.values()) {
                if (role.authority().equals(authority.getAuthority())) {
                    held.add(role);
                }
            }
        }
        return held;
    }
}
