package org.dockgate.accounts.web;

import java.security.Principal;
import java.util.EnumSet;
import java.util.Set;
import org.dockgate.accounts.AccountException;
import org.dockgate.accounts.AccountService;
import org.dockgate.platform.Role;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.ModelAttribute;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** ADMIN: create accounts, change roles, disable and enable. There is no delete: records keep their authors. */
@Controller
@RequestMapping("/admin/users")
class UsersController {

    static final String VIEW = "accounts/users";

    private final AccountService accounts;

    UsersController(AccountService accounts) {
        this.accounts = accounts;
    }

    record NewUserForm(String username, String displayName, String password, Set<Role> roles) {
        static NewUserForm empty() {
            return new NewUserForm("", "", "", EnumSet.noneOf(Role.class));
        }
    }

    @ModelAttribute("allRoles")
    Role[] allRoles() {
        return Role.values();
    }

    @GetMapping
    String list(Model model) {
        model.addAttribute("users", accounts.all());
        if (!model.containsAttribute("form")) {
            model.addAttribute("form", NewUserForm.empty());
        }
        return VIEW;
    }

    @PostMapping
    String create(@ModelAttribute("form") NewUserForm form, Model model, RedirectAttributes redirect) {
        try {
            var person = accounts.create(form.username(), form.displayName(), form.password(),
                    form.roles() == null ? Set.of() : form.roles());
            redirect.addFlashAttribute("notice", "Account " + person.username() + " created.");
            return "redirect:/admin/users";
        } catch (AccountException e) {
            model.addAttribute("errors", java.util.Map.of(e.field() == null ? "username" : e.field(), e.getMessage()));
            model.addAttribute("form", new NewUserForm(form.username(), form.displayName(), "", form.roles()));
            model.addAttribute("users", accounts.all());
            return VIEW;
        }
    }

    @PostMapping("/{id}/enabled")
    String setEnabled(@PathVariable long id, @RequestParam boolean enabled, @RequestParam long version,
                      Principal principal, RedirectAttributes redirect) {
        try {
            var person = accounts.setEnabled(id, enabled, version, principal.getName());
            redirect.addFlashAttribute("notice",
                    "Account " + person.username() + (enabled ? " enabled." : " disabled."));
        } catch (AccountException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:/admin/users";
    }

    @PostMapping("/{id}/roles")
    String changeRoles(@PathVariable long id, @RequestParam(name = "roles", required = false) Set<Role> roles,
                       @RequestParam long version, Principal principal, RedirectAttributes redirect) {
        try {
            var person = accounts.changeRoles(id, roles == null ? Set.of() : roles, version, principal.getName());
            redirect.addFlashAttribute("notice", "Roles of " + person.username() + " saved.");
        } catch (AccountException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:/admin/users";
    }
}
