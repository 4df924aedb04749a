package org.dockgate.web;

import org.springframework.stereotype.Controller;
import org.springframework.web.bind.annotation.GetMapping;

/** The login page and the start page, which lists what the person's roles let them do. */
@Controller
class HomeController {

    @GetMapping("/login")
    String login() {
        return "home/login";
    }

    @GetMapping("/")
    String home() {
        return "home/start";
    }
}
